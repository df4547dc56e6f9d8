/** Quotes drafted from a design revision: pricing, the document, sending, acceptance and expiry. Browser-safe: what other domains, pages and islands may use. */
export * from './firm';
export * from './pricing';
export * from './transitions';
export * from './decisions';
export * from './drafting';
