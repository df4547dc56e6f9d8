import { z } from 'zod';
import { railSpecSchema } from '../engine/rail-spec';
import { topologyIds } from '../engine/types';
import { withAgreedRequirement } from './agreed-requirement';

/** The requirement agreed with the client (see agreed-requirement.ts); checked again inside the spec. */
export const agreedRequirementSchema = z
  .object({
    outputV: z.number({ error: 'The output voltage must be a number in volts.' }).optional(),
    tolerance: z.number({ error: 'The tolerance must be a fraction, e.g. 0.02 for ±2 %.' }).optional(),
    maxRippleVpp: z.number({ error: 'The ripple limit must be a number in volts peak-to-peak.' }).optional(),
  })
  .strict();

/** What an engineer sends to save a revision: the choices on top of the client's brief. */
export const revisionRequestSchema = z
  .object({
    topology: z.enum(topologyIds, { error: `The topology must be one of ${topologyIds.join(', ')}.` }).optional(),
    weights: z.unknown().optional(),
    overrides: z.unknown().optional(),
    requirement: agreedRequirementSchema.optional(),
    note: z.string().max(4_000, { error: 'Keep the note under 4 000 characters.' }).default(''),
  })
  .strict();

export type RevisionRequest = z.infer<typeof revisionRequestSchema>;

/** The brief with the engineer's weights, overrides and agreed requirement in place, checked as one spec. */
export function briefWithChoices(spec: unknown, choices: Pick<RevisionRequest, 'weights' | 'overrides' | 'requirement'>) {
  return railSpecSchema.safeParse({
    ...withAgreedRequirement(spec, choices.requirement ?? {}),
    ...(choices.weights !== undefined ? { weights: choices.weights } : {}),
    ...(choices.overrides !== undefined ? { overrides: choices.overrides } : {}),
  });
}
