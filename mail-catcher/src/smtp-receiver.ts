import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { newMessageId, type MessageStore } from './message-store.ts';
import { parseMessage } from './stored-message.ts';

function smtpError(message: string, responseCode: number): Error {
  return Object.assign(new Error(message), { responseCode });
}

async function readAll(stream: SMTPServerDataStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

async function receive(store: MessageStore, stream: SMTPServerDataStream, session: SMTPServerSession, sizeLimit: number): Promise<string> {
  const raw = await readAll(stream);
  if (stream.sizeExceeded) {
    throw smtpError(`Message is larger than the catcher's limit of ${sizeLimit} bytes`, 552);
  }
  const mailFrom = session.envelope.mailFrom;
  const message = await parseMessage(raw, {
    id: newMessageId(),
    receivedAt: new Date(),
    envelope: {
      from: mailFrom ? mailFrom.address : null,
      to: session.envelope.rcptTo.map((recipient) => recipient.address),
    },
  });
  await store.save(message);
  return message.id;
}

/**
 * An SMTP server that accepts every message (with or without a login, never over TLS) and
 * answers only once the message is stored, so a sender that got "250" can read it back at once.
 */
export function createSmtpReceiver(store: MessageStore, sizeLimit: number, log: (line: string) => void): SMTPServer {
  const server = new SMTPServer({
    banner: 'Railwright local mail catcher: messages are stored, never delivered',
    authOptional: true,
    allowInsecureAuth: true,
    disabledCommands: ['STARTTLS'],
    size: sizeLimit,
    disableReverseLookup: true,
    closeTimeout: 1000,
    logger: false,
    onAuth(auth, _session, callback) {
      callback(null, { user: auth.username ?? 'anyone' });
    },
    onData(stream, session, callback) {
      receive(store, stream, session, sizeLimit).then(
        (id) => callback(null, `OK: stored as ${id}`),
        (error: Error & { responseCode?: number }) => {
          log(`could not store a message: ${error.message}`);
          callback(error.responseCode ? error : smtpError(`The catcher could not store the message: ${error.message}`, 451));
        },
      );
    },
  });
  // A client dropping its connection is reported here; without a listener it would end the process.
  server.on('error', (error) => log(`SMTP: ${error.message}`));
  return server;
}
