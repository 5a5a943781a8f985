import type { EntryKind } from '@/lib/visits/terms';
import { action } from '@/lib/visits/kinds/action';
import { condition } from '@/lib/visits/kinds/condition';
import { finding } from '@/lib/visits/kinds/finding';
import { leak } from '@/lib/visits/kinds/leak';
import { note } from '@/lib/visits/kinds/note';
import { part } from '@/lib/visits/kinds/part';
import { photo } from '@/lib/visits/kinds/photo';
import { reading } from '@/lib/visits/kinds/reading';
import { refrigerant } from '@/lib/visits/kinds/refrigerant';
import { settingChange } from '@/lib/visits/kinds/setting-change';
import type { EntryKindDef, UnitShape } from '@/lib/visits/kinds/types';

// Every entry kind, registered once. A new kind is one module here (schema, computed values,
// sentence, server handling) and one form in the visit page's kind table; tsc finds the rest.

export const entryKinds = {
  reading,
  finding,
  action,
  setting_change: settingChange,
  part,
  refrigerant,
  leak,
  condition,
  note,
  photo,
} satisfies { [K in EntryKind]: { kind: K } };

/** The kind's definition without its data type, for code that handles every kind alike. */
export function kindDef(kind: EntryKind): EntryKindDef<Record<string, unknown>> {
  return entryKinds[kind] as unknown as EntryKindDef<Record<string, unknown>>;
}

/** The kinds offered for a unit, in the order the visit page shows them. */
export function kindsFor(unit: UnitShape): EntryKind[] {
  return (Object.keys(entryKinds) as EntryKind[]).filter((k) => entryKinds[k].fits(unit));
}
