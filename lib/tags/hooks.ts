'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '@/lib/api/client';
import { saveRecord, useChange } from '@/lib/mutations';
import type { AttachResultDto, EquipmentTagInfoDto, LabelLayoutDto, PrintRunDto, ScanResultDto, TagDto } from '@/lib/tags/dto';
import type { AttachTagInput, CreatePrintRunInput, RetireTagInput, ScanVia } from '@/lib/tags/schemas';
import { equipmentKeys } from '@/lib/equipment/keys';
import { tagKeys } from '@/lib/tags/keys';


export function useLabelLayouts() {
  return useQuery({ queryKey: tagKeys.layouts(), queryFn: ({ signal }) => apiFetch<LabelLayoutDto[]>('/api/tags/layouts', { signal }) });
}

export function useCreatePrintRun() {
  return useChange((input: CreatePrintRunInput) => saveRecord<PrintRunDto>('/api/print-runs', undefined, input), tagKeys.all);
}

export function useEquipmentTagInfo(equipmentId: string, initialData?: EquipmentTagInfoDto) {
  return useQuery({
    queryKey: tagKeys.equipment(equipmentId),
    queryFn: ({ signal }) => apiFetch<EquipmentTagInfoDto>(`/api/tags?equipmentId=${equipmentId}`, { signal }),
    initialData,
  });
}

export function useAttachTag() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ code, input }: { code: string; input: AttachTagInput }) =>
      apiFetch<AttachResultDto>(`/api/tags/${code}/attach`, { method: 'POST', json: input }),
    onSuccess: (result) => {
      void qc.invalidateQueries({ queryKey: tagKeys.all });
      void qc.invalidateQueries({ queryKey: equipmentKeys.all });
      return result;
    },
  });
}

export function useRetireTag() {
  return useChange(({ code, input }: { code: string; input: RetireTagInput }) => apiFetch<TagDto>(`/api/tags/${code}/retire`, { method: 'POST', json: input }), tagKeys.all);
}

export function useScan() {
  return useMutation({
    mutationFn: ({ code, via }: { code: string; via: ScanVia }) => apiFetch<ScanResultDto>('/api/scan', { method: 'POST', json: { code, via } }),
  });
}
