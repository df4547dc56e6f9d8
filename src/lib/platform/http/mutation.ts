/**
 * The one way a request changes something, for API routes and page form posts
 * alike: guard the role, read the body with a byte limit while streaming,
 * check it with its schema, call the domain, and turn its outcome into the
 * answer — JSON for the API, a redirect (post/redirect/get) or the page again
 * with the refusal's message for a form.
 */
import type { APIContext, APIRoute, AstroGlobal } from 'astro';
import type { z } from 'zod';
import { invalidInput, succeed, type Outcome, type Refusal } from '../outcome';
import type { Role } from '../auth/roles';
import { JSON_BODY_LIMIT, readFormFields, readJsonBody } from './body';
import { guardApi, type SignedInUser } from './guard';
import { refusalResponse, statusOf } from './responses';
import { zodIssues } from './validation';

/** Who may call: the listed roles (signed in), or anyone (sign-up, sign-in, public evaluation). */
export type Access = readonly Role[] | 'anyone';
type CallerOf<A extends Access> = A extends 'anyone' ? App.Locals['user'] : SignedInUser;

interface ApiMutationSpec<A extends Access, S extends z.ZodType, T> {
  access: A;
  /** The JSON body's schema; omit for actions that take no body. */
  body?: S;
  /** A request with no body at all reads as `{}` (for a body whose every field is optional). */
  bodyOptional?: true;
  /** The error code of a body that fails the schema (e.g. `invalid_quote`). */
  invalidCode?: string;
  maxBytes?: number;
  run: (input: { user: CallerOf<A>; body: z.infer<S>; context: APIContext }) => Promise<Outcome<T>>;
  /** The success answer, usually `json(...)`. */
  answer: (value: T, context: APIContext) => Response;
}

function checked<S extends z.ZodType>(schema: S, value: unknown, code: string): Outcome<z.infer<S>> {
  const parsed = schema.safeParse(value);
  return parsed.success ? { ok: true, value: parsed.data } : invalidInput(code, zodIssues(parsed.error));
}

const hasNoBody = (request: Request) =>
  request.body === null || (request.headers.get('content-length') === '0' && !request.headers.has('transfer-encoding'));

/**
 * The role is checked before the body is read, so an anonymous caller cannot
 * make the server read (or parse) anything on a guarded route.
 */
export function apiMutation<A extends Access, S extends z.ZodType, T>(spec: ApiMutationSpec<A, S, T>): APIRoute {
  return async (context) => {
    let user = context.locals.user as CallerOf<A>;
    if (spec.access !== 'anyone') {
      const gate = guardApi(context, spec.access as readonly Role[]);
      if (!gate.ok) return gate.response;
      user = gate.user as CallerOf<A>;
    }
    let body: z.infer<S> = undefined as z.infer<S>;
    if (spec.body) {
      const raw =
        spec.bodyOptional && hasNoBody(context.request)
          ? succeed<unknown>({})
          : await readJsonBody(context.request, spec.maxBytes ?? JSON_BODY_LIMIT);
      if (!raw.ok) return refusalResponse(raw);
      const valid = checked(spec.body, raw.value, spec.invalidCode ?? 'invalid_body');
      if (!valid.ok) return refusalResponse(valid);
      body = valid.value;
    }
    const outcome = await spec.run({ user, body, context });
    return outcome.ok ? spec.answer(outcome.value, context) : refusalResponse(outcome);
  };
}

interface FormPostSpec<S extends z.ZodType, T> {
  /** The fields' schema (every field arrives as a string). */
  fields: S;
  run: (fields: z.infer<S>) => Promise<Outcome<T>>;
  /** Where the browser goes on success (303, so a reload does not post again), or a whole answer (e.g. with cookies). */
  then: (value: T) => string | Response;
}

/** What a refused form post leaves for the page to show: the message, each field's error, and what was typed. */
export interface RefusedForm {
  refusal: Refusal;
  errors: Record<string, string>;
  typed: Record<string, string>;
}

/**
 * A page's form post. The page has already guarded its role (one guard per
 * page); this reads and checks the fields, runs the action and answers.
 * Returns null on a GET, a Response to return on success, or what to show.
 */
export async function handleFormPost<S extends z.ZodType, T>(
  astro: AstroGlobal,
  spec: FormPostSpec<S, T>,
): Promise<Response | RefusedForm | null> {
  if (astro.request.method !== 'POST') return null;
  const read = await readFormFields(astro.request);
  const typed = read.ok ? read.value : {};
  const valid = read.ok ? checked(spec.fields, read.value, 'invalid_form') : read;
  const outcome = valid.ok ? await spec.run(valid.value) : valid;
  if (outcome.ok) {
    const next = spec.then(outcome.value);
    return typeof next === 'string' ? astro.redirect(next, 303) : next;
  }
  astro.response.status = statusOf(outcome);
  if (outcome.retryAfterSeconds !== undefined) astro.response.headers.set('retry-after', String(outcome.retryAfterSeconds));
  const errors: Record<string, string> = {};
  for (const issue of outcome.issues ?? []) if (issue.path && !(issue.path in errors)) errors[issue.path] = issue.message;
  return { refusal: outcome, errors, typed };
}

/** The message a page shows after a successful post redirected back with `?done=`. */
export function doneMessage<K extends string>(url: URL, messages: Record<K, string>): string | null {
  const done = url.searchParams.get('done');
  return done !== null && Object.hasOwn(messages, done) ? messages[done as K] : null;
}
