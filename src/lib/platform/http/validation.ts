import type { z } from 'zod';
import { invalid, readJson, type FieldIssue } from './responses';

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join('.'), message: issue.message }));
}

/** Reads a JSON body and checks it with a schema; answers 400/413/415 itself. */
export async function parseBody<S extends z.ZodType>(
  request: Request,
  schema: S,
  error = 'invalid_body',
): Promise<{ ok: true; value: z.infer<S> } | { ok: false; response: Response }> {
  const body = await readJson(request);
  if (!body.ok) return body;
  const parsed = schema.safeParse(body.value);
  if (!parsed.success) return { ok: false, response: invalid(error, zodIssues(parsed.error)) };
  return { ok: true, value: parsed.data };
}
