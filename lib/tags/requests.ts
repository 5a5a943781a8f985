import { apiFetch } from '@/lib/api/client';
import type { AttachResultDto, TagDto } from '@/lib/tags/dto';
import type { AttachTagInput, RetireTagInput } from '@/lib/tags/schemas';

// The tag API's writes, written once: the hooks (hooks.ts) wrap them in the query library, a
// unit's page calls them plainly, since it ships without that library (DEVELOPERS.md, "Phone pages").

const tagPath = (code: string) => `/api/tags/${code}`;

export function attachTag(code: string, input: AttachTagInput): Promise<AttachResultDto> {
  return apiFetch<AttachResultDto>(`${tagPath(code)}/attach`, { method: 'POST', json: input });
}

export function retireTag(code: string, input: RetireTagInput): Promise<TagDto> {
  return apiFetch<TagDto>(`${tagPath(code)}/retire`, { method: 'POST', json: input });
}
