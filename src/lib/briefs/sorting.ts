/**
 * What a brief list may be sorted by (the API's `sort`, the desk's columns); a leading '-'
 * reverses it. Free of imports, so the desk island ships these words alone.
 */
export const BRIEF_SORT_KEYS = ['updated', 'submitted', 'title'] as const;
export type BriefSortKey = (typeof BRIEF_SORT_KEYS)[number];
export type BriefSort = BriefSortKey | `-${BriefSortKey}`;
