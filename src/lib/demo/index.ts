/** The fictional demo scenario and the seed that loads it. Browser-safe: what other domains, pages and islands may use. */
export * from './lifecycle';
export * from './scenario';
