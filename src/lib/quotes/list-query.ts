/** The quote lists' filters and paging: the `GET /api/v1/quotes` query and the list pages' address. Browser-safe. */
import { z } from 'zod';
import { QUOTE_STATES } from '../platform/db/schema';

export const QUOTE_LIST_PAGE_SIZES = [10, 25, 50] as const;

export const quoteListQuerySchema = z.object({
  state: z.enum(QUOTE_STATES, { error: 'Unknown state.' }).optional(),
  /** Matches the quote number, the brief's title, the client's name or company. */
  q: z.string().trim().max(100).optional(),
  /** A client's id (staff only; a client's list is always their own). */
  client: z.string().max(64).optional(),
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
