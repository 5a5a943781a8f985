import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { getCompany } from '@/lib/users/company';
import { CompanyForm } from '@/app/(app)/settings/_components/company-form';

export const metadata: Metadata = { title: 'Company settings' };

export default async function CompanySettingsPage() {
  const actor = await requirePageActor('/settings/company', 'company.settings');
  const company = await getCompany(actor);
  return (
    <>
      <PageHeader title="Company settings" subtitle="Shown on printed tags and reports." />
      <CompanyForm company={company} />
    </>
  );
}
