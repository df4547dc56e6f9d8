/** The quote lists' filters and paging: the `GET /api/v1/quotes` query and the list pages' address. Browser-safe. */
import { z } from 'zod';
import { QUOTE_STATES } from '../platform/db/schema';

export const QUOTE_LIST_PAGE_SIZES = [10, 25, 50] as const;

/** A filter the list form sends empty ("any") is no filter, not a bad one. */
const unlessBlank = <T extends z.ZodType>(schema: T) => z.preprocess((v) => (v === '' ? undefined : v), schema.optional());

export const quoteListQuerySchema = z.object({
  state: unlessBlank(z.enum(QUOTE_STATES, { error: 'Unknown state.' })),
  /** Matches the quote number, the brief's title, the client's name or company. */
  q: unlessBlank(z.string().trim().max(100)),
  /** A client's id (staff only; a client's list is always their own). */
  client: unlessBlank(z.string().max(64)),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(25),
});
export type QuoteListQuery = z.infer<typeof quoteListQuerySchema>;

/** The address of one page of a list with these filters; empty filters are left out. */
export function quoteListHref(base: string, query: Partial<QuoteListQuery>): string {
  const params = new URLSearchParams();
  if (query.state) params.set('state', query.state);
  if (query.q) params.set('q', query.q);
  if (query.client) params.set('client', query.client);
  if (query.page && query.page > 1) params.set('page', String(query.page));
  if (query.pageSize && query.pageSize !== 25) params.set('pageSize', String(query.pageSize));
  const search = params.toString();
  return search ? `${base}?${search}` : base;
}
