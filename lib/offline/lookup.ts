import type { PackUnit, SitePack } from '@/lib/sites/pack-schema';
import { normalizeCode } from '@/lib/tags/code';

// Finding a unit among kept packs: pure, so a unit test covers it without a browser.

export type UnitQuery = { id: string } | { code: string };

export interface FoundUnit<P extends { pack: SitePack } = { pack: SitePack }> {
  kept: P;
  unit: PackUnit;
}

/** The unit with this equipment id or tag code (typed or scanned, normalised as tags are), newest pack first. */
export function findUnit<P extends { pack: SitePack }>(kept: P[], query: UnitQuery): FoundUnit<P> | null {
  const byNewest = [...kept].sort((a, b) => b.pack.takenAt.localeCompare(a.pack.takenAt));
  const code = 'code' in query ? normalizeCode(query.code) : null;
  const id = 'id' in query ? query.id.toLowerCase() : null;
  if (code === '' || id === '') return null;
  for (const k of byNewest) {
    const unit = k.pack.units.find((u) => (code !== null ? u.tagCode === code : u.id === id));
    if (unit) return { kept: k, unit };
  }
  return null;
}
