/** The balance invoice issued on delivery: its figures and number. Browser-safe: what other domains, pages and islands may use. */
export * from './figures';
