'use client';

import { useRouter } from 'next/navigation';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { QueryProvider } from '@/components/query/query-provider';
import type { PlanDto } from '@/lib/plans/dto';
import { useStartVisit } from '@/lib/visits/hooks';

type PlanRef = Pick<PlanDto, 'id' | 'siteId' | 'reason' | 'siteName'>;

/** Starts the visit a plan describes; the server marks the plan started with it. Brings its own
 * query provider: the home page, where it also shows, has none (DEVELOPERS.md, "Phone pages"). */
export function StartPlanButton({ plan }: { plan: PlanRef }) {
  return (
    <QueryProvider>
      <StartPlanButtonInner plan={plan} />
    </QueryProvider>
  );
}

function StartPlanButtonInner({ plan }: { plan: PlanRef }) {
  const router = useRouter();
  const start = useStartVisit();
  return (
    <div className="w-full space-y-2">
      <Button
        size="lg"
        disabled={start.isPending}
        onClick={() => start.mutate({ siteId: plan.siteId, reason: plan.reason, planId: plan.id }, { onSuccess: (visit) => router.push(`/visits/${visit.id}`) })}
      >
        {start.isPending ? 'Starting…' : 'Start this visit'}
      </Button>
      {start.error ? (
        <Alert tone="danger" title="The visit was not started">
          {start.error.message}
        </Alert>
      ) : null}
    </div>
  );
}
