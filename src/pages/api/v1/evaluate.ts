import type { APIRoute } from 'astro';
import { currentCatalog } from '~/lib/catalog/catalog.server';
import { railSpecIssues, railSpecSchema } from '~/lib/engine';
import { EngineBusyError, evaluateToJson } from '~/lib/platform/engine-pool';
import { readJsonBody } from '~/lib/platform/http/body';
import { apiError, invalid, jsonText, refusalResponse, tooMany } from '~/lib/platform/http/responses';
import { clientAddressOf } from '~/lib/platform/rate-limit/client-address';
import { limitEvaluate } from '~/lib/platform/rate-limit/evaluate-limit';

/** Ranks the options for a brief; anyone may call it (rate-limited), nothing is stored. */
export const POST: APIRoute = async (context) => {
  const limited = await limitEvaluate(clientAddressOf(context));
  if (!limited.allowed) return tooMany(limited.retryAfterSeconds);
  const body = await readJsonBody(context.request, 32 * 1024);
  if (!body.ok) return refusalResponse(body);
  const parsed = railSpecSchema.safeParse(body.value);
  if (!parsed.success) return invalid('invalid_brief', railSpecIssues(parsed.error));
  try {
    return jsonText(await evaluateToJson(parsed.data, await currentCatalog()));
  } catch (error) {
    if (!(error instanceof EngineBusyError)) throw error;
    return apiError(503, 'busy', { message: 'The engine is at capacity. Try again in a second.' }, { 'retry-after': '1' });
  }
};
