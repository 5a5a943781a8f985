import { notFound, redirect } from 'next/navigation';
import { codeFromPathSegment } from '@/lib/tags/code';

// Lower-case alias of the tag route: /tag/k7q-m3x-9pa → /T/K7QM3X9PA (keeps ?via=).
export const dynamic = 'force-dynamic';

export default async function TagAliasPage({
  params,
  searchParams,
}: {
  params: Promise<{ code: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const code = codeFromPathSegment((await params).code);
  if (!code) notFound();
  const via = (await searchParams).via;
  redirect(`/T/${code}${typeof via === 'string' ? `?via=${encodeURIComponent(via)}` : ''}`);
}
