/** The desk's view (filters, sort, page) as the list API's query string, for the island and the URL bar. */
import { BRIEF_SORT_KEYS, type BriefSortKey } from '~/lib/briefs/sorting';

export type DeskSortKey = BriefSortKey;

export interface DeskView {
  state: string;
  client: string;
  q: string;
  sort: DeskSortKey;
  desc: boolean;
  page: number;
  pageSize: number;
}

export const PAGE_SIZES = [10, 25, 50] as const;

export function viewToParams(view: DeskView): URLSearchParams {
  const params = new URLSearchParams();
  if (view.state) params.set('state', view.state);
  if (view.client) params.set('client', view.client);
  if (view.q.trim()) params.set('q', view.q.trim());
  params.set('sort', `${view.desc ? '-' : ''}${view.sort}`);
  params.set('page', String(view.page));
  params.set('pageSize', String(view.pageSize));
  return params;
}

export function sortParam(sort: string): { sort: DeskSortKey; desc: boolean } {
  const desc = sort.startsWith('-');
  const key = sort.replace(/^-/, '');
  return { sort: (BRIEF_SORT_KEYS as readonly string[]).includes(key) ? (key as DeskSortKey) : 'updated', desc };
}
