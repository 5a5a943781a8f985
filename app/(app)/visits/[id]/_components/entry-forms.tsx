'use client';

import type { ReactNode } from 'react';
import type { EquipmentDto } from '@/lib/equipment/dto';
import type { UnitPrefs } from '@/lib/units/quantities';
import type { EntryContext } from '@/lib/visits/kinds/types';
import type { EntryKind } from '@/lib/visits/terms';
import type { SubmitResult } from '@/app/(app)/visits/[id]/_components/form-kit';
import { ActionForm } from '@/app/(app)/visits/[id]/_components/kinds/action-form';
import { ConditionForm } from '@/app/(app)/visits/[id]/_components/kinds/condition-form';
import { FindingForm } from '@/app/(app)/visits/[id]/_components/kinds/finding-form';
import { LeakForm } from '@/app/(app)/visits/[id]/_components/kinds/leak-form';
import { NoteForm } from '@/app/(app)/visits/[id]/_components/kinds/note-form';
import { PartForm } from '@/app/(app)/visits/[id]/_components/kinds/part-form';
import { ReadingForm } from '@/app/(app)/visits/[id]/_components/kinds/reading-form';
import { RefrigerantForm } from '@/app/(app)/visits/[id]/_components/kinds/refrigerant-form';
import { SettingForm } from '@/app/(app)/visits/[id]/_components/kinds/setting-form';
import { PhotoForm } from '@/app/(app)/visits/[id]/_components/photo-form';

// The visit page's form for each entry kind, registered once beside lib/visits/kinds.

export interface EntryFormProps {
  unit: EquipmentDto;
  ctx: EntryContext;
  prefs: UnitPrefs;
  refrigerantCautions: string[];
  /** `stay`: keep the form open after saving (photos are linked one after another). */
  onSubmit: (data: unknown, opts?: { stay: boolean }) => Promise<SubmitResult>;
  onCancel: () => void;
  /** Photos chosen but not yet sent: the workspace guards its other ways out while there are any. */
  onUnsentChange: (count: number) => void;
  /** Without signal: photos into the visit's outbox. */
  keepPhotosOffline: (files: File[]) => Promise<void>;
}

export const entryForms: Record<EntryKind, (p: EntryFormProps) => ReactNode> = {
  reading: (p) => <ReadingForm ctx={p.ctx} prefs={p.prefs} refrigerantCautions={p.refrigerantCautions} onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  setting_change: (p) => <SettingForm unit={p.unit} ctx={p.ctx} prefs={p.prefs} onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  finding: (p) => <FindingForm onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  action: (p) => <ActionForm onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  part: (p) => <PartForm equipmentName={p.unit.name} onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  refrigerant: (p) => <RefrigerantForm ctx={p.ctx} prefs={p.prefs} refrigerantCautions={p.refrigerantCautions} onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  leak: (p) => <LeakForm refrigerantCautions={p.refrigerantCautions} onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  condition: (p) => <ConditionForm current={p.unit.condition} onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  note: (p) => <NoteForm onSubmit={(d) => p.onSubmit(d)} onCancel={p.onCancel} />,
  photo: (p) => <PhotoForm equipmentId={p.unit.id} onSubmit={(d) => p.onSubmit(d, { stay: true })} onDone={p.onCancel} onUnsentChange={p.onUnsentChange} onKeepOffline={p.keepPhotosOffline} />,
};
