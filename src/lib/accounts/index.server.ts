/** People and their accounts: the server-only services other domains may call. */
export * from './accounts.server';
export * from './people.server';
export * from './notifications.server';
export * from './billing.server';
