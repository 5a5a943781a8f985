import { Archive, Download, Plus, Upload } from 'lucide-react';
import Link from 'next/link';
import { EquipmentList } from '@/components/equipment/equipment-list';
import { ButtonLink, buttonVariants } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/card';
import type { EquipmentDto } from '@/lib/equipment/dto';
import type { AreaDto } from '@/lib/sites/dto';
import { Section } from '@/components/ui/section';

interface Group {
  key: string;
  title: string;
  items: EquipmentDto[];
}

/** Groups in the site's area order; equipment without an area comes last. */
function groupByArea(items: EquipmentDto[], areas: AreaDto[]): Group[] {
  const order = new Map(areas.map((a, i) => [a.id, i]));
  const groups = new Map<string, Group>();
  for (const e of items) {
    const key = e.areaId ?? '';
    const group = groups.get(key) ?? { key, title: e.areaName ?? 'No area', items: [] };
    group.items.push(e);
    groups.set(key, group);
  }
  const rank = (g: Group) => (g.key === '' ? Number.MAX_SAFE_INTEGER : (order.get(g.key) ?? areas.length));
  return [...groups.values()].sort((a, b) => rank(a) - rank(b) || a.title.localeCompare(b.title));
}

export function SiteEquipment({
  siteId,
  items,
  removed,
  more,
  areas,
  canRegister,
  canImport,
}: {
  siteId: string;
  items: EquipmentDto[];
  /** Removed units, listed apart with their removal date and what replaced them. */
  removed: EquipmentDto[];
  more: boolean;
  areas: AreaDto[];
  canRegister: boolean;
  canImport: boolean;
}) {
  const groups = groupByArea(items, areas);
  return (
    <Section
      id="equipment-h"
      title="Equipment"
      actions={
        <div className="flex flex-wrap gap-2">
          {canRegister ? (
            <ButtonLink href={`/equipment/new?siteId=${siteId}`}>
              <Plus aria-hidden className="size-4" /> Register equipment
            </ButtonLink>
          ) : null}
          {canImport ? (
            <ButtonLink href={`/sites/${siteId}/import`} variant="secondary">
              <Upload aria-hidden className="size-4" /> Import CSV
            </ButtonLink>
          ) : null}
          {/* A plain link: the browser downloads the file with the session cookie. */}
          <a href={`/api/equipment/export?siteId=${siteId}`} download className={buttonVariants({ variant: 'secondary' })}>
            <Download aria-hidden className="size-4" /> Export CSV
          </a>
        </div>
      }
    >
      {groups.length === 0 ? (
        <EmptyState title="No equipment registered at this site yet.">
          {canRegister ? 'Register units one by one, or import a spreadsheet exported from another site.' : null}
        </EmptyState>
      ) : (
        groups.map((g) => (
          <div key={g.key} className="space-y-2">
            <h3 className="text-base font-semibold text-slate-800">
              {g.title} <span className="font-normal text-slate-600">({g.items.length})</span>
            </h3>
            <EquipmentList items={g.items} empty="" showLife />
          </div>
        ))
      )}
      {removed.length > 0 ? (
        <details className="rounded-lg border border-slate-200 bg-slate-50" data-testid="site-removed-equipment">
          <summary className="flex min-h-11 cursor-pointer items-center gap-2 px-4 font-semibold text-slate-900">
            <Archive aria-hidden className="size-4" /> Removed <span className="font-normal text-slate-600">({removed.length})</span>
          </summary>
          <div className="space-y-2 border-t border-slate-200 p-2">
            <p className="px-2 text-sm text-slate-700">Units taken out or replaced. Their history is kept on their own pages.</p>
            <EquipmentList items={removed} empty="" showArea />
          </div>
        </details>
      ) : null}
      {more ? (
        <p>
          <Link href={`/equipment?siteId=${siteId}`} className="font-semibold text-ice-800 underline">
            This site has more equipment than fits here: see it all in the equipment table
          </Link>
        </p>
      ) : null}
    </Section>
  );
}
