import type { z } from 'zod';
import type { ErrorIssue } from '@/lib/errors';

export function zodIssues(error: z.ZodError): ErrorIssue[] {
  return error.issues.map((i) => ({ path: i.path.map(String).join('.'), message: i.message }));
}
