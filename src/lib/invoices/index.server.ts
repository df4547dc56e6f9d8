/** The balance invoice issued on delivery: the server-only services other domains may call. */
export * from './document.server';
export * from './issue.server';
export * from './mail.server';
export * from './view.server';
