/** The device-class catalog the engine designs from, as the admin edits it. Browser-safe: what other domains, pages and islands may use. */
export * from './rows';
export * from './class-form';
export * from './field-look';
