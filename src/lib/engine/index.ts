// Public surface of the engine.
export { evaluate, DEFAULT_SEED } from './evaluate.ts';
export { briefSchema, briefIssues, noiseClassDefaults, defaultWeights, noiseClasses, type Brief, type BriefInput, type BriefIssue, type NoiseClass } from './brief.ts';
export { catalogSchema, defaultCatalog, type Catalog } from './catalog.ts';
export { formatSi, parseSi } from './units.ts';
export { E_SERIES, snap, type SeriesName } from './eseries.ts';
export { toSpiceNetlist, type SpiceCorner } from './spice.ts';
export * from './types.ts';
