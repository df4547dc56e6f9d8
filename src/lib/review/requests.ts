import { z } from 'zod';
import { railSpecSchema } from '../engine/rail-spec';
import { topologyIds } from '../engine/types';

/** What an engineer sends to save a revision: the choices on top of the client's brief. */
export const revisionRequestSchema = z
  .object({
    topology: z.enum(topologyIds, { error: `The topology must be one of ${topologyIds.join(', ')}.` }).optional(),
    weights: z.unknown().optional(),
    overrides: z.unknown().optional(),
    note: z.string().max(4_000, { error: 'Keep the note under 4 000 characters.' }).default(''),
  })
  .strict();

export type RevisionRequest = z.infer<typeof revisionRequestSchema>;

/** The brief with the engineer's weights and overrides in place, checked as one brief. */
export function briefWithChoices(spec: unknown, choices: Pick<RevisionRequest, 'weights' | 'overrides'>) {
  const base = (spec && typeof spec === 'object' ? spec : {}) as Record<string, unknown>;
  return railSpecSchema.safeParse({
    ...base,
    ...(choices.weights !== undefined ? { weights: choices.weights } : {}),
    ...(choices.overrides !== undefined ? { overrides: choices.overrides } : {}),
  });
}
