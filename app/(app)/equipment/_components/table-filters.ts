import { REFRIGERANT_IDS, type RefrigerantId } from '@/lib/calc/refrigerants';
import type { EquipmentListFilters } from '@/lib/equipment/hooks';
import { EQUIPMENT_SORTS, type EquipmentSort } from '@/lib/equipment/schemas';
import { EQUIPMENT_STATUSES, EQUIPMENT_TYPES, type EquipmentStatus, type EquipmentType } from '@/lib/equipment/types';

// The table's filters live in the URL so a filtered view can be shared. Anything in a pasted URL
// that the API would refuse is dropped here rather than shown as an error.

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function oneOf<T extends string>(values: readonly T[], input: string[]): T[] {
  return [...new Set(input.filter((v): v is T => (values as readonly string[]).includes(v)))];
}

export function parseFilters(params: Pick<URLSearchParams, 'get' | 'getAll'>): EquipmentListFilters {
  const id = (key: string) => {
    const v = params.get(key);
    return v && UUID.test(v) ? v : undefined;
  };
  const sort = params.get('sort') ?? '';
  const q = (params.get('q') ?? '').trim().slice(0, 200);
  return {
    siteId: id('siteId'),
    areaId: id('areaId'),
    systemId: id('systemId'),
    type: oneOf<EquipmentType>(EQUIPMENT_TYPES, params.getAll('type')),
    condition: oneOf(['1', '2', '3', '4', '5'], params.getAll('condition')).map(Number),
    refrigerant: oneOf<RefrigerantId>(REFRIGERANT_IDS, params.getAll('refrigerant')),
    // Removed units have a view of their own, not a status filter among current units.
    status: oneOf<EquipmentStatus>(EQUIPMENT_STATUSES, params.getAll('status')).filter((s) => s !== 'removed'),
    ...(params.get('removed') === 'only' ? { removed: 'only' as const } : {}),
    q: q || undefined,
    sort: (EQUIPMENT_SORTS as readonly string[]).includes(sort) ? (sort as EquipmentSort) : 'name',
    dir: params.get('dir') === 'desc' ? 'desc' : 'asc',
  };
}

export function hasActiveFilters(f: EquipmentListFilters): boolean {
  return Boolean(f.siteId || f.areaId || f.systemId || f.q || f.type.length || f.condition.length || f.refrigerant.length || f.status.length);
}
