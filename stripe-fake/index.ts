export {
  startStripeFake,
  DEFAULT_PORT,
  DEFAULT_WEBHOOK_SECRET,
  DEFAULT_RETRY_DELAYS_MS,
  type StripeFake,
  type StripeFakeOptions,
} from './src/server.ts';
export { SUCCESS_CARD, DECLINE_CARD, DECLINE_MESSAGE } from './src/card-payments.ts';
export { stripeFakeOptionsFromEnv, DEFAULT_WEBHOOK_URL } from './src/env.ts';
