export { startStripeFake, DEFAULT_PORT, DEFAULT_WEBHOOK_SECRET, type StripeFake, type StripeFakeOptions } from './src/server.ts';
export { stripeFakeOptionsFromEnv } from './src/env.ts';
export { SUCCESS_CARD, DECLINE_CARD } from './src/card-payments.ts';
