/** The engineers' review of a brief: the server-only services other domains may call. */
export * from './exports.server';
export * from './forms.server';
export * from './page.server';
export * from './revision-compare.server';
export * from './revisions.server';
