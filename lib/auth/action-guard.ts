import 'server-only';
import { headers } from 'next/headers';
import { assertSameOrigin, assertValidText } from '@/lib/api/guards';

/**
 * The first line of every server action: refuses a post from another origin (403) and a form
 * with a NUL or broken Unicode in any field (422) before anything is looked up. Next also
 * compares Origin with Host for actions; this adds the app's own origin list and Sec-Fetch-Site.
 */
export async function guardAction(form?: FormData): Promise<void> {
  assertSameOrigin({ method: 'POST', headers: await headers() });
  if (form) assertValidText(Object.fromEntries([...form.entries()].map(([k, v]) => [k, typeof v === 'string' ? v : v.name])));
}
