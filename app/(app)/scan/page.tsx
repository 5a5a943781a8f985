import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { ScanPageScanner } from '@/app/(app)/scan/_components/scan-page-scanner';

export const metadata: Metadata = { title: 'Scan' };

export default async function ScanPage() {
  await requirePageActor('/scan', 'tags.scan');
  return (
    <>
      <PageHeader title="Scan" subtitle="Scan an equipment tag to open the unit and its history." />
      <ScanPageScanner />
    </>
  );
}
