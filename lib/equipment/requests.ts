import { apiFetch } from '@/lib/api/client';
import type { Page } from '@/lib/api/cursor';
import type { RelationDto } from '@/lib/equipment/dto';
import type { CreateRelationInput } from '@/lib/equipment/schemas';

// The equipment API's writes, written once: the hooks (hooks.ts) wrap them in the query library,
// a unit's page calls them plainly, since it ships without that library (DEVELOPERS.md, "Phone pages").

const unitPath = (id: string) => `/api/equipment/${id}`;
const relationsPath = (id: string) => `${unitPath(id)}/relations`;

export function deleteEquipment(id: string): Promise<void> {
  return apiFetch<void>(unitPath(id), { method: 'DELETE' });
}

/** Returns the unit's relations after the change. */
export function addRelation(id: string, input: CreateRelationInput): Promise<Page<RelationDto>> {
  return apiFetch<Page<RelationDto>>(relationsPath(id), { method: 'POST', json: input });
}

export function removeRelation(id: string, relationId: string): Promise<void> {
  return apiFetch<void>(`${relationsPath(id)}/${relationId}`, { method: 'DELETE' });
}
