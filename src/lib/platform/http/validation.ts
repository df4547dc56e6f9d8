import type { z } from 'zod';
import type { FieldIssue } from '../outcome';

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join('.'), message: issue.message }));
}
