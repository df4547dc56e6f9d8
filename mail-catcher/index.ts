export { startMailCatcher, type MailCatcher, type MailCatcherOptions } from './src/server.ts';
export { mailCatcherOptionsFromEnv, type MailCatcherSettings } from './src/env.ts';
export { MessageStore } from './src/message-store.ts';
export type { StoredMessage, StoredAttachment, MessageSummary, AttachmentSummary, MailAddress } from './src/stored-message.ts';
