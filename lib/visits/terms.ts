// The visit's own words, shared by every kind, form and report. Imports only the list helper:
// anything may use it.
import { labelled } from '@/lib/labelled';

export const { values: VISIT_REASONS, labels: visitReasonLabels } = labelled({
  no_cooling: 'No-cooling call',
  maintenance: 'Maintenance',
  install: 'Install',
  inspection: 'Inspection',
  leak_check: 'Leak check',
  follow_up: 'Follow-up',
});
export type VisitReason = (typeof VISIT_REASONS)[number];

export const { values: SEVERITIES, labels: severityLabels } = labelled({ safety: 'Safety', down: 'Down', degraded: 'Degraded', minor: 'Minor' });
export type Severity = (typeof SEVERITIES)[number];

/** Mirrored by the entries.kind check constraint; each kind is a module in lib/visits/kinds/. */
export const { values: ENTRY_KINDS, labels: entryKindLabels } = labelled({
  reading: 'Readings',
  finding: 'Finding',
  action: 'Action',
  setting_change: 'Setting change',
  part: 'Part replaced',
  refrigerant: 'Refrigerant',
  leak: 'Leak work',
  condition: 'Condition',
  note: 'Note',
  photo: 'Photo',
});
export type EntryKind = (typeof ENTRY_KINDS)[number];
