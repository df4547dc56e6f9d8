/**
 * What a domain action answers: the value it produced, or a refusal that says
 * why in words a person can act on. Services return these and never HTTP
 * statuses; `http/mutation.ts` is the one place that turns a refusal into a
 * JSON answer or a form page's message.
 */

export interface FieldIssue {
  path: string;
  message: string;
}

/** Why an action did not happen. Each kind maps to one HTTP status (http/refusal.ts). */
export type RefusalKind =
  | 'invalid' // the input does not read: field issues say where
  | 'unauthenticated' // the credentials do not match
  | 'not-found' // no such thing, or not the caller's
  | 'forbidden' // the caller's role may not do this
  | 'wrong-state' // the thing exists but is not in a state that allows it
  | 'too-large' // a body or file over its limit
  | 'unsupported-type' // a file or body of a type the action does not take
  | 'rate-limited' // too many attempts; `retryAfterSeconds` says when to try again
  | 'unavailable' // a service the action needs is not set up here
  | 'upstream-failed'; // a service the action needs did not answer

export interface Refusal {
  ok: false;
  kind: RefusalKind;
  message: string;
  /** A stable machine-readable code for API callers; defaults per kind. */
  code?: string;
  issues?: FieldIssue[];
  retryAfterSeconds?: number;
}

export type Outcome<T> = { ok: true; value: T } | Refusal;

export const succeed = <T>(value: T): Outcome<T> => ({ ok: true, value });

export function refuse(kind: RefusalKind, message: string, extra: Pick<Refusal, 'code' | 'issues' | 'retryAfterSeconds'> = {}): Refusal {
  return { ok: false, kind, message, ...extra };
}

/** An invalid-input refusal whose message is the first issue's, so a form can show it alone. */
export function invalidInput(code: string, issues: FieldIssue[]): Refusal {
  return refuse('invalid', issues[0]?.message ?? 'The input does not read.', { code, issues });
}

/** The one answer for what is missing or belongs to someone else: a client must not learn which. */
export const notYours = (): Refusal => refuse('not-found', 'Nothing here, or it is not yours.');
