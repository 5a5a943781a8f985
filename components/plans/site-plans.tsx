import { PlanCard } from '@/components/plans/plan-card';
import { StartPlanButton } from '@/components/plans/start-plan-button';
import type { PlanDto } from '@/lib/plans/dto';
import { Section } from '@/components/ui/section';
import { TextLink } from '@/components/ui/text-link';

/** A site's coming planned visits (on its own page, so no site link); the technician a plan names starts it here on its day (`canStart`). */
export function SitePlans({ plans, siteId, canPlan }: { plans: PlanDto[]; siteId: string; canPlan: boolean }) {
  return (
    <Section
      id="site-plans-h"
      title="Planned visits"
      actions={canPlan ? <TextLink href={`/plans/new?siteId=${siteId}`}>Plan a visit here</TextLink> : null}
    >
      {plans.length === 0 ? (
        <p className="text-slate-700">No visit planned yet.</p>
      ) : (
        <ul className="grid gap-2 md:grid-cols-2">
          {plans.map((p) => (
            <li key={p.id} className="min-w-0">
              <PlanCard plan={p} showDay linkSite={false}>
                {p.canStart ? <StartPlanButton plan={p} /> : null}
              </PlanCard>
            </li>
          ))}
        </ul>
      )}
    </Section>
  );
}
