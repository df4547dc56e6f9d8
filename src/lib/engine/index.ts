// Public surface of the engine.
export { evaluate, DEFAULT_SEED } from './evaluate.ts';
export {
  railSpecSchema,
  railSpecIssues,
  noiseClassDefaults,
  defaultWeights,
  noiseClasses,
  type RailSpec,
  type RailSpecInput,
  type RailSpecIssue,
  type NoiseClass,
} from './rail-spec.ts';
export { catalogSchema, CLASS_LISTS, defaultCatalog, offeredCatalog, type Catalog, type ClassList } from './catalog.ts';
export { formatSi, numberFormsHint, parseSi } from './units.ts';
export { classPhrase, formatKPerW, lowerFirst, shortBy } from './units.ts';
export { E_SERIES, snap, type SeriesName } from './eseries.ts';
export { toSpiceNetlist, type SpiceCorner } from './spice/index.ts';
export * from './types.ts';
