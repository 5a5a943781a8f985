// The visit's own words, shared by every kind, form and report. No imports: anything may use it.

export const VISIT_REASONS = ['no_cooling', 'maintenance', 'install', 'inspection', 'leak_check', 'follow_up'] as const;
export type VisitReason = (typeof VISIT_REASONS)[number];
export const visitReasonLabels: Record<VisitReason, string> = {
  no_cooling: 'No-cooling call',
  maintenance: 'Maintenance',
  install: 'Install',
  inspection: 'Inspection',
  leak_check: 'Leak check',
  follow_up: 'Follow-up',
};

export const SEVERITIES = ['safety', 'down', 'degraded', 'minor'] as const;
export type Severity = (typeof SEVERITIES)[number];
export const severityLabels: Record<Severity, string> = {
  safety: 'Safety',
  down: 'Down',
  degraded: 'Degraded',
  minor: 'Minor',
};

/** Mirrored by the entries.kind check constraint; each kind is a module in lib/visits/kinds/. */
export const ENTRY_KINDS = ['reading', 'finding', 'action', 'setting_change', 'part', 'refrigerant', 'leak', 'condition', 'note', 'photo'] as const;
export type EntryKind = (typeof ENTRY_KINDS)[number];
export const entryKindLabels: Record<EntryKind, string> = {
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
};
