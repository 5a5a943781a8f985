import { notFound } from 'next/navigation';
import { codeFromPathSegment } from '@/lib/tags/code';

/** What the tag routes (/T/<code> and its lower-case alias /tag/<code>) receive. */
export interface TagRouteProps {
  params: Promise<{ code: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}

/** The tag code in the path, read case-insensitively; a segment that is no code is a 404. */
export async function tagCodeOrNotFound(params: TagRouteProps['params']): Promise<string> {
  const code = codeFromPathSegment((await params).code);
  if (!code) notFound();
  return code;
}
