/** Quotes drafted from a design revision: the server-only services other domains may call. */
export * from './core.server';
export * from './document.server';
export * from './expiry.server';
export * from './list.server';
export * from './mail.server';
export * from './quotes.server';
export * from './rate-card.server';
export * from './render.server';
export * from './view.server';
export * from './document-parts.server';
