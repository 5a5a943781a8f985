// The words of planned visits (only the list helper imported): pages, forms, e-mails and tests all use them.
import { labelled } from '@/lib/labelled';

export const { values: PLAN_STATUSES, labels: planStatusLabels } = labelled({ planned: 'Planned', started: 'Started', cancelled: 'Cancelled' });
export type PlanStatus = (typeof PLAN_STATUSES)[number];

/** A plan whose day has passed without the visit being started. */
export const OVERDUE_LABEL = 'Not started — day passed';
