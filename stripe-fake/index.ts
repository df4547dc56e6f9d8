export { startStripeFake, type StripeFake, type StripeFakeOptions } from './src/server.ts';
export { stripeFakeOptionsFromEnv, type StripeFakeSettings } from './src/env.ts';
export { SUCCESS_CARD, DECLINE_CARD } from './src/checkout/card-payments.ts';
