'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { applyServerErrors } from '@/components/forms/server-errors';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, describedBy } from '@/components/ui/field';
import type { PlanDto } from '@/lib/plans/dto';
import { useCancelPlan, useMovePlan } from '@/lib/plans/hooks';
import { cancelPlanSchema, movePlanSchema } from '@/lib/plans/schemas';
import { SelectOptions } from '@/components/forms/select-options';

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

function MoveForm({ plan, technicians, onDone }: { plan: PlanDto; technicians: { id: string; name: string }[]; onDone: () => void }) {
  const router = useRouter();
  const move = useMovePlan(plan.id);
  const [banner, setBanner] = useState<string>();
  const form = useForm<MoveValues>({
    resolver: zodResolver(movePlanSchema),
    defaultValues: { technicianId: plan.technicianId, day: plan.day, windowStart: plan.windowStart, windowEnd: plan.windowEnd },
  });
  const errors = form.formState.errors;
  const id = (name: string) => `move-${plan.id}-${name}`;
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await move.mutateAsync(movePlanSchema.parse(values));
      onDone();
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, ['technicianId', 'day', 'windowStart', 'windowEnd']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-3 rounded-md border border-slate-200 bg-slate-50 p-3 sm:grid-cols-2" aria-label="Move this plan">
      {banner ? <Alert tone="danger" title={banner} className="sm:col-span-2" /> : null}
      <Field id={id('day')} label="Day (site calendar)" error={errors.day?.message}>
        <Input id={id('day')} type="date" {...describedBy(id('day'), errors.day?.message)} {...form.register('day')} />
      </Field>
      <Field id={id('tech')} label="Technician" error={errors.technicianId?.message}>
        <Select id={id('tech')} {...describedBy(id('tech'), errors.technicianId?.message)} {...form.register('technicianId')}>
          <SelectOptions options={technicians.map((t) => ({ value: t.id, label: t.name }))} />
        </Select>
      </Field>
      <Field id={id('start')} label="From (site time)" error={errors.windowStart?.message}>
        <Input id={id('start')} type="time" {...describedBy(id('start'), errors.windowStart?.message)} {...form.register('windowStart')} />
      </Field>
      <Field id={id('end')} label="To (site time)" error={errors.windowEnd?.message}>
        <Input id={id('end')} type="time" {...describedBy(id('end'), errors.windowEnd?.message)} {...form.register('windowEnd')} />
      </Field>
      <div className="sm:col-span-2">
        <Button type="submit" disabled={form.formState.isSubmitting}>
          Save the move
        </Button>
      </div>
    </form>
  );
}

function CancelForm({ plan, onDone }: { plan: PlanDto; onDone: () => void }) {
  const router = useRouter();
  const cancel = useCancelPlan(plan.id);
  const [banner, setBanner] = useState<string>();
  const form = useForm<CancelValues>({ resolver: zodResolver(cancelPlanSchema), defaultValues: { reason: '' } });
  const errors = form.formState.errors;
  const fieldId = `cancel-${plan.id}-reason`;
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await cancel.mutateAsync(cancelPlanSchema.parse(values));
      onDone();
      router.refresh();
    } catch (error) {
      setBanner(applyServerErrors(error, form.setError, ['reason']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3 rounded-md border border-slate-200 bg-slate-50 p-3" aria-label="Cancel this plan">
      {banner ? <Alert tone="danger" title={banner} /> : null}
      <Field id={fieldId} label="Why (optional, the client's contacts may read it)" error={errors.reason?.message}>
        <Input id={fieldId} {...describedBy(fieldId, errors.reason?.message)} {...form.register('reason')} />
      </Field>
      <Button type="submit" variant="danger" disabled={form.formState.isSubmitting}>
        Cancel this plan
      </Button>
    </form>
  );
}
