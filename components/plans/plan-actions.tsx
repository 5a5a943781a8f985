'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import { BoundField } from '@/components/forms/bound-field';
import { BoundSelect } from '@/components/forms/bound-select';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import type { PlanDto } from '@/lib/plans/dto';
import { useCancelPlan, useMovePlan } from '@/lib/plans/hooks';
import { cancelPlanSchema, movePlanSchema } from '@/lib/plans/schemas';

type MoveValues = z.input<typeof movePlanSchema>;
type CancelValues = z.input<typeof cancelPlanSchema>;

/** Move (day, window, technician) and Cancel plan, for the office while a plan is planned. */
export function PlanActions({ plan, technicians }: { plan: PlanDto; technicians: { id: string; name: string }[] }) {
  const [open, setOpen] = useState<'move' | 'cancel' | null>(null);
  if (!plan.canChange) return null;
  return (
    <div className="w-full space-y-3">
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" aria-expanded={open === 'move'} onClick={() => setOpen(open === 'move' ? null : 'move')}>
          Move
        </Button>
        <Button variant="secondary" aria-expanded={open === 'cancel'} onClick={() => setOpen(open === 'cancel' ? null : 'cancel')}>
          Cancel plan
        </Button>
      </div>
      {open === 'move' ? <MoveForm plan={plan} technicians={technicians} onDone={() => setOpen(null)} /> : null}
      {open === 'cancel' ? <CancelForm plan={plan} onDone={() => setOpen(null)} /> : null}
    </div>
  );
}

/**
 * Sends one change of a planned visit: on success closes the form and reloads the page's data; a
 * refusal puts the server's field issues on the fields and its message in the banner.
 */
function usePlanChange<T extends FieldValues, S>(form: UseFormReturn<T>, send: (values: T) => Promise<S>, fields: readonly Path<T>[], onDone: () => void) {
  const router = useRouter();
  const [banner, setBanner] = useState<string>();
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await send(values);
      onDone();
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, fields));
    }
  });
  return { banner, onSubmit };
}

function MoveForm({ plan, technicians, onDone }: { plan: PlanDto; technicians: { id: string; name: string }[]; onDone: () => void }) {
  const move = useMovePlan(plan.id);
  const form = useForm<MoveValues>({
    resolver: zodResolver(movePlanSchema),
    defaultValues: { technicianId: plan.technicianId, day: plan.day, windowStart: plan.windowStart, windowEnd: plan.windowEnd },
  });
  const { banner, onSubmit } = usePlanChange(form, (values) => move.mutateAsync(movePlanSchema.parse(values)), ['technicianId', 'day', 'windowStart', 'windowEnd'], onDone);
  const id = (name: string) => `move-${plan.id}-${name}`;
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-3 rounded-md border border-slate-200 bg-slate-50 p-3 sm:grid-cols-2" aria-label="Move this plan">
      {banner ? <Alert tone="danger" title={banner} className="sm:col-span-2" /> : null}
      <BoundField form={form} name="day" id={id('day')} label="Day (site calendar)" input={{ type: 'date' }} />
      <BoundSelect form={form} name="technicianId" id={id('tech')} label="Technician" options={technicians.map((t) => ({ value: t.id, label: t.name }))} />
      <BoundField form={form} name="windowStart" id={id('start')} label="From (site time)" input={{ type: 'time' }} />
      <BoundField form={form} name="windowEnd" id={id('end')} label="To (site time)" input={{ type: 'time' }} />
      <div className="sm:col-span-2">
        <Button type="submit" disabled={form.formState.isSubmitting}>
          Save the move
        </Button>
      </div>
    </form>
  );
}

function CancelForm({ plan, onDone }: { plan: PlanDto; onDone: () => void }) {
  const cancel = useCancelPlan(plan.id);
  const form = useForm<CancelValues>({ resolver: zodResolver(cancelPlanSchema), defaultValues: { reason: '' } });
  const { banner, onSubmit } = usePlanChange(form, (values) => cancel.mutateAsync(cancelPlanSchema.parse(values)), ['reason'], onDone);
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3 rounded-md border border-slate-200 bg-slate-50 p-3" aria-label="Cancel this plan">
      {banner ? <Alert tone="danger" title={banner} /> : null}
      <BoundField form={form} name="reason" id={`cancel-${plan.id}-reason`} label="Why (optional, the client's contacts may read it)" />
      <Button type="submit" variant="danger" disabled={form.formState.isSubmitting}>
        Cancel this plan
      </Button>
    </form>
  );
}
