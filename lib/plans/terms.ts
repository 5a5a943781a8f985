// The words of planned visits. No imports: pages, forms, e-mails and tests all use them.

export const PLAN_STATUSES = ['planned', 'started', 'cancelled'] as const;
export type PlanStatus = (typeof PLAN_STATUSES)[number];
export const planStatusLabels: Record<PlanStatus, string> = {
  planned: 'Planned',
  started: 'Started',
  cancelled: 'Cancelled',
};

/** A plan whose day has passed without the visit being started. */
export const OVERDUE_LABEL = 'Not started — day passed';
