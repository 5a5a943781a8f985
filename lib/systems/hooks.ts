'use client';

import { equipmentKeys } from '@/lib/equipment/keys';
import { archiveRecord, saveRecord, useChange } from '@/lib/mutations';
import type { SystemDto } from '@/lib/systems/dto';
import { systemKeys } from '@/lib/systems/keys';
import type { CreateSystemInput, UpdateSystemInput } from '@/lib/systems/schemas';

export { systemKeys };

export function useSaveSystem(id?: string) {
  return useChange((input: CreateSystemInput | UpdateSystemInput) => saveRecord<SystemDto>('/api/systems', id, input), systemKeys.all, equipmentKeys.all);
}

export function useArchiveSystem(id: string) {
  return useChange((archived: boolean) => archiveRecord<SystemDto>(`/api/systems/${id}`, archived), systemKeys.all);
}
