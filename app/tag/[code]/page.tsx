import { redirect } from 'next/navigation';
import { tagCodeOrNotFound, type TagRouteProps } from '@/app/T/[code]/tag-route';

// Lower-case alias of the tag route: /tag/k7q-m3x-9pa → /T/K7QM3X9PA (keeps ?via=).
export const dynamic = 'force-dynamic';

export default async function TagAliasPage({ params, searchParams }: TagRouteProps) {
  const code = await tagCodeOrNotFound(params);
  const via = (await searchParams).via;
  redirect(`/T/${code}${typeof via === 'string' ? `?via=${encodeURIComponent(via)}` : ''}`);
}
