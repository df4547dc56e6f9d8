/**
 * Request bodies of the briefs API, shared by the wizard (react-hook-form),
 * the routes and the tests. The supply brief itself is the engine's schema.
 */
import { z } from 'zod';
import { railSpecSchema } from '../engine/rail-spec';
import type { FieldIssue } from '../platform/outcome';
import { BRIEF_STATES } from './states';

export const DEFAULT_BRIEF_TITLE = 'Untitled supply rail';
const MAX_SPEC_CHARS = 16_000;

const title = z
  .string()
  .trim()
  .min(1, { error: 'Give the brief a short title.' })
  .max(160, { error: 'Keep the title under 160 characters.' });
const notes = z.string().max(8_000, { error: 'Keep the notes under 8 000 characters.' });

function valueAt(root: unknown, path: readonly PropertyKey[]): unknown {
  let at = root;
  for (const key of path) {
    if (at === null || typeof at !== 'object') return undefined;
    at = (at as Record<PropertyKey, unknown>)[key];
  }
  return at;
}

// What a draft may not hold even before submit: a value of the wrong kind, an unknown choice, a field that is not part of a brief.
const WRONG_KIND = new Set(['invalid_type', 'invalid_value', 'unrecognized_keys']);

/**
 * The values a draft holds that can never be right: a draft may lack fields
 * until it is submitted, but what it has must be of its kind (a known source,
 * a number where a number goes). Ranges and cross-field rules wait for submit.
 */
export function draftSpecIssues(spec: Record<string, unknown>): (FieldIssue & { segments: PropertyKey[] })[] {
  const parsed = railSpecSchema.safeParse(spec);
  if (parsed.success) return [];
  return parsed.error.issues.flatMap((issue) => {
    if (!WRONG_KIND.has(issue.code)) return [];
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) => ({
        segments: [...issue.path, key],
        path: [...issue.path, key].map(String).join('.'),
        message: 'This field is not part of a supply brief.',
      }));
    }
    // A missing or cleared field is fine in a draft; a present one of the wrong kind is not.
    const value = valueAt(spec, issue.path);
    if (value === undefined || value === null || value === '') return [];
    return [{ segments: [...issue.path], path: issue.path.map(String).join('.'), message: issue.message }];
  });
}

/** A stored draft with its impossible values left out, so the wizard opens on what can be kept. */
export function keepableDraftSpec(spec: Record<string, unknown>): Record<string, unknown> {
  const copy = structuredClone(spec);
  for (const { segments } of draftSpecIssues(spec)) {
    const parent = valueAt(copy, segments.slice(0, -1));
    if (parent && typeof parent === 'object') delete (parent as Record<PropertyKey, unknown>)[segments.at(-1) as PropertyKey];
  }
  return copy;
}

/** A draft may be incomplete: an object of bounded size whose values are of their kind; it is checked in full on submit. */
const draftSpec = z
  .record(z.string(), z.unknown(), { error: 'The spec must be an object of brief fields.' })
  .refine((value) => JSON.stringify(value).length <= MAX_SPEC_CHARS, { error: 'The spec is too large.' })
  .superRefine((value, ctx) => {
    for (const issue of draftSpecIssues(value)) ctx.addIssue({ code: 'custom', path: issue.segments.map(String), message: issue.message });
  });

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

export const MAX_MESSAGE_ATTACHMENTS = 5;

/** A message in a brief's thread with the client (either side writes it). */
export const messageRequestSchema = z
  .object({
    body: z
      .string({ error: 'Write your message.' })
      .trim()
      .min(1, { error: 'Write your message.' })
      .max(4_000, { error: 'Keep the message under 4 000 characters.' }),
    /** Files uploaded to the brief (`POST /api/v1/briefs/:id/files`) by the writer, sent with this message. */
    attachmentIds: z
      .array(z.string().min(1).max(64))
      .max(MAX_MESSAGE_ATTACHMENTS, { error: `Attach at most ${MAX_MESSAGE_ATTACHMENTS} files to one message.` })
      .default([]),
  })
  .strict();
export type MessageRequest = z.infer<typeof messageRequestSchema>;

/** The client's page forms: withdrawing a brief and deleting a draft each take a deliberate confirmation. */
export const withdrawFormSchema = z.object({
  intent: z.literal('withdraw'),
  confirm: z.literal('yes', { error: 'Tick “Yes, withdraw” to confirm; the brief was not withdrawn.' }),
});
export const deleteDraftFormSchema = z.object({
  intent: z.literal('delete'),
  briefId: z.string().min(1).max(64),
});
