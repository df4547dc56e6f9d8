/** The engineers' review of a brief: saved design revisions, their figures and words, comparisons and exports. Browser-safe: what other domains, pages and islands may use. */
export * from './choices';
export * from './compare';
export * from './figures';
export * from './option-words';
export * from './requests';
export * from './words';
export * from './agreed-requirement';
