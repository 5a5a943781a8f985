import { withApi } from '@/lib/api/handler';
import { updateCompanySchema } from '@/lib/users/schemas';
import { getCompany, updateCompany } from '@/lib/users/service';

// GET /api/company: the caller's company settings.
export const GET = withApi({}, async ({ actor }) => getCompany(actor));

// PATCH /api/company: edit company settings (admin).
export const PATCH = withApi({ permission: 'company.settings', body: updateCompanySchema }, async ({ actor, body }) => updateCompany(actor, body));
