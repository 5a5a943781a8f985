import type { Metadata } from 'next';
import Link from 'next/link';
import { z } from 'zod';
import { PlanActions } from '@/components/plans/plan-actions';
import { PlanCard } from '@/components/plans/plan-card';
import { StartPlanButton } from '@/components/plans/start-plan-button';
import { Alert } from '@/components/ui/alert';
import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { requirePageActor } from '@/lib/auth';
import { formatWeekday } from '@/lib/format/local-times';
import { addDays, weekDays, weekStart } from '@/lib/plans/days';
import type { PlanDto } from '@/lib/plans/dto';
import { listPlanTechnicians, officeToday } from '@/lib/plans/scheduling';
import { listPlans } from '@/lib/plans/service';

export const metadata: Metadata = { title: 'Planned visits' };

const querySchema = z.object({ week: z.iso.date().optional().catch(undefined), planned: z.uuid().optional().catch(undefined) });

/** Plans of one day grouped by technician, in the order of their first window. */
function byTechnician(plans: PlanDto[]): { name: string; id: string; plans: PlanDto[] }[] {
  const groups = new Map<string, { name: string; id: string; plans: PlanDto[] }>();
  for (const p of plans) {
    const g = groups.get(p.technicianId) ?? { name: p.technicianName, id: p.technicianId, plans: [] };
    g.plans.push(p);
    groups.set(p.technicianId, g);
  }
  return [...groups.values()];
}

export default async function PlannedVisitsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const query = querySchema.parse(await searchParams);
  const actor = await requirePageActor('/plans', 'plans.read');
  // The week's days are calendar days; each plan's day and window are its own site's.
  const today = await officeToday(actor);
  const monday = weekStart(query.week ?? today);
  const days = weekDays(monday);
  const plans = await listPlans(actor, { from: days[0], to: days[6], limit: 500 });
  const canPlan = plans.canCreate;
  const technicians = canPlan ? await listPlanTechnicians(actor) : [];
  const justPlanned = query.planned ? plans.items.find((p) => p.id === query.planned) : undefined;

  return (
    <div className="space-y-5">
      <PageHeader
        title="Planned visits"
        subtitle={`Week of ${formatWeekday(monday)} · each window is in its site’s own time`}
        actions={canPlan ? <ButtonLink href="/plans/new" size="lg">Plan a visit</ButtonLink> : null}
      />
      <nav aria-label="Weeks" className="flex flex-wrap gap-2">
        <ButtonLink href={`/plans?week=${addDays(monday, -7)}`} variant="secondary">
          Previous week
        </ButtonLink>
        <ButtonLink href="/plans" variant="secondary">
          This week
        </ButtonLink>
        <ButtonLink href={`/plans?week=${addDays(monday, 7)}`} variant="secondary">
          Next week
        </ButtonLink>
      </nav>
      {justPlanned ? (
        <Alert tone="success" title="Visit planned">
          {justPlanned.siteName}, {formatWeekday(justPlanned.day)}, with {justPlanned.technicianName}.
        </Alert>
      ) : null}
      {days.map((day) => {
        const todays = plans.items.filter((p) => p.day === day);
        const headingId = `day-${day}`;
        return (
          <section key={day} aria-labelledby={headingId} className="space-y-2">
            <h2 id={headingId} className="border-b border-slate-200 pb-1 text-lg font-semibold">
              {formatWeekday(day)}
              {day === today ? ' · today' : ''}
              <span className="ml-2 text-sm font-normal text-slate-600">
                {todays.length === 0 ? 'nothing planned' : `${todays.length} planned`}
              </span>
            </h2>
            {byTechnician(todays).map((group) => (
              <div key={group.id} className="space-y-2">
                <h3 className="font-semibold text-slate-800">{group.name}</h3>
                <ul className="grid gap-2 lg:grid-cols-2">
                  {group.plans.map((plan) => (
                    <li key={plan.id} className="min-w-0">
                      <PlanCard plan={plan} showTechnician={false}>
                        {plan.canStart ? <StartPlanButton plan={plan} /> : null}
                        {plan.visitId ? (
                          <Link href={`/visits/${plan.visitId}`} className="inline-flex min-h-11 items-center font-semibold text-ice-800 underline">
                            Open the visit
                          </Link>
                        ) : null}
                        {plan.canChange ? <PlanActions plan={plan} technicians={technicians} /> : null}
                      </PlanCard>
                    </li>
                  ))}
                </ul>
              </div>
            ))}
          </section>
        );
      })}
    </div>
  );
}
