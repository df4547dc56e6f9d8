/** A client's request for a rail, from the wizard's draft to a paid deposit: its states and who may move them, its requests, its files and notes. Browser-safe: what other domains, pages and islands may use. */
export * from './json';
export * from './load-log';
export * from './requests';
export * from './sorting';
export * from './states';
export * from './summary';
export * from './transitions';
export * from './wizard-defaults';
export * from './wizard-form';
export * from './spec-diff';
