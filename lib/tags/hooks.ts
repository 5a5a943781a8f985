'use client';

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { saveRecord, useChange } from '@/lib/mutations';
import type { PrintRunDto } from '@/lib/tags/dto';
import type { AttachTagInput, CreatePrintRunInput } from '@/lib/tags/schemas';
import { equipmentKeys } from '@/lib/equipment/keys';
import { tagKeys } from '@/lib/tags/keys';
import { attachTag } from '@/lib/tags/requests';

export function useCreatePrintRun() {
  return useChange((input: CreatePrintRunInput) => saveRecord<PrintRunDto>('/api/print-runs', undefined, input), tagKeys.all);
}

export function useAttachTag() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ code, input }: { code: string; input: AttachTagInput }) => attachTag(code, input),
    onSuccess: (result) => {
      void qc.invalidateQueries({ queryKey: tagKeys.all });
      void qc.invalidateQueries({ queryKey: equipmentKeys.all });
      return result;
    },
  });
}
