/** The fictional demo scenario and the seed that loads it: the server-only services other domains may call. */
export * from './seed.server';
