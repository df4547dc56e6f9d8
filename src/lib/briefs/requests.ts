/**
 * Request bodies of the briefs API, shared by the wizard (react-hook-form),
 * the routes and the tests. The supply brief itself is the engine's schema.
 */
import { z } from 'zod';
import { BRIEF_STATES } from './states';

export const DEFAULT_BRIEF_TITLE = 'Untitled supply rail';
const MAX_SPEC_CHARS = 16_000;

const title = z
  .string()
  .trim()
  .min(1, { error: 'Give the brief a short title.' })
  .max(160, { error: 'Keep the title under 160 characters.' });
const notes = z.string().max(8_000, { error: 'Keep the notes under 8 000 characters.' });

/** A draft may be incomplete: any JSON object of bounded size; it is checked in full on submit. */
const draftSpec = z
  .record(z.string(), z.unknown(), { error: 'The spec must be an object of brief fields.' })
  .refine((value) => JSON.stringify(value).length <= MAX_SPEC_CHARS, { error: 'The spec is too large.' });

export const createBriefSchema = z
  .object({
    title: title.default(DEFAULT_BRIEF_TITLE),
    spec: draftSpec.default({}),
    notes: notes.default(''),
    submit: z.boolean({ error: 'submit must be true or false.' }).default(false),
  })
  .strict();

export const clientBriefPatchSchema = z
  .object({
    title: title.optional(),
    spec: draftSpec.optional(),
    notes: notes.optional(),
    submit: z.boolean({ error: 'submit must be true or false.' }).optional(),
    state: z.literal('cancelled', { error: 'You can only cancel a brief yourself.' }).optional(),
  })
  .strict();

export const staffBriefPatchSchema = z
  .object({
    state: z.enum(BRIEF_STATES, { error: 'Choose one of the brief states.' }),
    note: z.string().max(2_000).default(''),
  })
  .strict();

export const briefListQuerySchema = z.object({
  state: z.enum(BRIEF_STATES, { error: 'Unknown state.' }).optional(),
  q: z.string().max(100).optional(),
  client: z.string().max(64).optional(),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
  sort: z.enum(['updated', '-updated', 'submitted', '-submitted', 'title', '-title']).default('-updated'),
});

export type CreateBrief = z.infer<typeof createBriefSchema>;
