/** The device-class catalog the engine designs from, as the admin edits it: the server-only services other domains may call. */
export * from './catalog.server';
