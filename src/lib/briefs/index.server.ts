/** A client's request for a rail, from the wizard's draft to a paid deposit: the server-only services other domains may call. */
export * from './actions.server';
export * from './briefs.server';
export * from './file-store.server';
export * from './files.server';
export * from './mail.server';
export * from './moves.server';
export * from './notes.server';
export * from './messages.server';
