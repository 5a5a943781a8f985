'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { optionsOf } from '@/components/forms/select-options';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { weekStart } from '@/lib/plans/days';
import { useCreatePlan } from '@/lib/plans/hooks';
import { createPlanSchema } from '@/lib/plans/schemas';
import { VISIT_REASONS, visitReasonLabels, type VisitReason } from '@/lib/visits/terms';

type Values = z.input<typeof createPlanSchema>;

interface Props {
  siteId: string;
  siteToday: string;
  systems: { id: string; name: string }[];
  equipment: { id: string; name: string }[];
  technicians: { id: string; name: string }[];
  defaults: { systemIds: string[]; equipmentIds: string[]; reason?: VisitReason; day?: string };
}

/** Plan a visit: what for, why, who, and a day with a window in the site's own time. */
export function PlanForm({ siteId, siteToday, systems, equipment, technicians, defaults }: Props) {
  const router = useRouter();
  const create = useCreatePlan();
  const [banner, setBanner] = useState<string>();
  const form = useForm<Values>({
    resolver: zodResolver(createPlanSchema),
    defaultValues: {
      siteId,
      systemIds: defaults.systemIds,
      equipmentIds: defaults.equipmentIds,
      reason: defaults.reason ?? ('' as VisitReason),
      technicianId: technicians.length === 1 ? technicians[0]!.id : '',
      day: defaults.day && defaults.day >= siteToday ? defaults.day : siteToday,
      windowStart: '08:00',
      windowEnd: '10:00',
      note: '',
    },
  });
  const errors = form.formState.errors;
  const systemIds = useWatch({ control: form.control, name: 'systemIds' }) ?? [];
  const equipmentIds = useWatch({ control: form.control, name: 'equipmentIds' }) ?? [];
  const toggle = (field: 'systemIds' | 'equipmentIds', list: string[], id: string, on: boolean) =>
    form.setValue(field, on ? [...list, id] : list.filter((x) => x !== id), { shouldDirty: true });

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const plan = await create.mutateAsync(createPlanSchema.parse(values));
      router.push(`/plans?week=${weekStart(plan.day)}&planned=${plan.id}`);
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, ['reason', 'technicianId', 'day', 'windowStart', 'windowEnd', 'systemIds', 'equipmentIds', 'note']));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid max-w-2xl gap-4">
      {banner ? <Alert tone="danger" title={banner} /> : null}
      <BoundSelect form={form} name="reason" id="plan-reason" label="Reason" placeholder="Choose…" options={optionsOf(VISIT_REASONS, visitReasonLabels)} />
      <fieldset className="space-y-1">
        <legend className="text-sm font-semibold text-slate-800">Systems</legend>
        {systems.length === 0 ? <p className="text-sm text-slate-700">No systems at this site yet: the visit is for the whole site.</p> : null}
        {systems.map((s) => (
          <label key={s.id} className="flex min-h-11 items-center gap-3 text-base">
            <input type="checkbox" className="size-5" checked={systemIds.includes(s.id)} onChange={(e) => toggle('systemIds', systemIds, s.id, e.target.checked)} />
            <span className="min-w-0 break-words">{s.name}</span>
          </label>
        ))}
        {errors.systemIds ? <p role="alert" className="text-sm font-medium text-red-700">{errors.systemIds.message ?? 'Choose systems of this site.'}</p> : null}
        <p className="text-sm text-slate-600">Choose none to plan for the whole site.</p>
      </fieldset>
      {equipment.length ? (
        <details className="rounded-md border border-slate-200 p-3" open={equipmentIds.length > 0}>
          <summary className="flex min-h-11 cursor-pointer items-center font-semibold">Single units ({equipmentIds.length} chosen)</summary>
          <div className="mt-2 space-y-1">
            {equipment.map((e) => (
              <label key={e.id} className="flex min-h-11 items-center gap-3">
                <input type="checkbox" className="size-5" checked={equipmentIds.includes(e.id)} onChange={(ev) => toggle('equipmentIds', equipmentIds, e.id, ev.target.checked)} />
                <span className="min-w-0 break-words">{e.name}</span>
              </label>
            ))}
          </div>
        </details>
      ) : null}
      <BoundSelect form={form} name="technicianId" id="plan-technician" label="Technician" placeholder="Choose…" options={technicians.map((t) => ({ value: t.id, label: t.name }))} />
      <BoundField form={form} name="day" id="plan-day" label="Day (site calendar)" input={{ type: 'date', min: siteToday }} />
      <div className="grid grid-cols-2 gap-3">
        <BoundField form={form} name="windowStart" id="plan-start" label="From (site time)" input={{ type: 'time' }} />
        <BoundField form={form} name="windowEnd" id="plan-end" label="To (site time)" input={{ type: 'time' }} />
      </div>
      <BoundField form={form} name="note" id="plan-note" label="Note for the technician (optional)" multiline />
      <div>
        <Button type="submit" size="lg" disabled={form.formState.isSubmitting}>
          Plan this visit
        </Button>
      </div>
    </form>
  );
}
