import { withApi } from '@/lib/api/handler';
import { updateCompanySchema } from '@/lib/users/schemas';
import { getCompany, updateCompany } from '@/lib/users/company';

// GET /api/company: the company settings (admin, as the matrix's company.settings and the README say).
export const GET = withApi({ permission: 'company.settings' }, async ({ actor }) => getCompany(actor));

// PATCH /api/company: edit company settings (admin).
export const PATCH = withApi({ permission: 'company.settings', body: updateCompanySchema }, async ({ actor, body }) => updateCompany(actor, body));
