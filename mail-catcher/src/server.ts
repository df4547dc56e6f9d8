import type { Server as HttpServer } from 'node:http';
import type { AddressInfo, Server } from 'node:net';
import { resolve } from 'node:path';
import type { SMTPServer } from 'smtp-server';
import { createHttpApi } from './http-api.ts';
import { MessageStore } from './message-store.ts';
import { createSmtpReceiver } from './smtp-receiver.ts';

export const DEFAULT_SMTP_PORT = 2525;
export const DEFAULT_HTTP_PORT = 2526;
export const DEFAULT_DIR = 'data/mail-catcher';
const DEFAULT_SIZE_LIMIT = 25 * 1024 * 1024;

export interface MailCatcherOptions {
  /** 0 picks a free port; read the chosen one from the result. Default 2525. */
  smtpPort?: number;
  /** 0 picks a free port. Default 2526. */
  httpPort?: number;
  /** Folder for the messages, one JSON file each. Default `data/mail-catcher` (from the working directory). */
  dir?: string;
  /** Default 127.0.0.1. */
  host?: string;
  /** Largest message accepted, in bytes. Default 25 MB. */
  sizeLimit?: number;
  /** Receives a line when a message cannot be stored or a request fails; silent by default. */
  log?: (line: string) => void;
}

export interface MailCatcher {
  /** e.g. smtp://127.0.0.1:2525, usable as the app's SMTP_URL. */
  smtpUrl: string;
  /** e.g. http://127.0.0.1:2526; messages are under /messages. */
  apiUrl: string;
  smtpPort: number;
  httpPort: number;
  dir: string;
  close(): Promise<void>;
}

function listenOn(server: Server, port: number, host: string, what: string): Promise<number> {
  return new Promise((resolvePort, reject) => {
    const onError = (error: NodeJS.ErrnoException) => {
      reject(
        error.code === 'EADDRINUSE'
          ? new Error(
              `The mail catcher's ${what} cannot listen on ${host}:${port}: the port is already in use (is another catcher running?). Stop it or choose another port.`,
            )
          : error,
      );
    };
    server.once('error', onError);
    server.listen(port, host, () => {
      server.off('error', onError);
      resolvePort((server.address() as AddressInfo).port);
    });
  });
}

function closeSmtp(smtp: SMTPServer): Promise<void> {
  return new Promise((done) => smtp.close(() => done()));
}

function closeHttp(http: HttpServer): Promise<void> {
  return new Promise((done, fail) => {
    http.close((error) => (error ? fail(error) : done()));
    http.closeAllConnections();
  });
}

/** Starts the SMTP catcher and its HTTP API in this process. */
export async function startMailCatcher(options: MailCatcherOptions = {}): Promise<MailCatcher> {
  const host = options.host ?? '127.0.0.1';
  const log = options.log ?? (() => {});
  const dir = resolve(options.dir ?? DEFAULT_DIR);
  const store = new MessageStore(dir);
  await store.open();
  const smtp = createSmtpReceiver(store, options.sizeLimit ?? DEFAULT_SIZE_LIMIT, log);
  const http = createHttpApi(store, log);
  const smtpPort = await listenOn(smtp.server, options.smtpPort ?? DEFAULT_SMTP_PORT, host, 'SMTP server');
  let httpPort: number;
  try {
    httpPort = await listenOn(http, options.httpPort ?? DEFAULT_HTTP_PORT, host, 'HTTP API');
  } catch (error) {
    await closeSmtp(smtp);
    throw error;
  }
  return {
    smtpUrl: `smtp://${host}:${smtpPort}`,
    apiUrl: `http://${host}:${httpPort}`,
    smtpPort,
    httpPort,
    dir,
    close: async () => {
      await Promise.all([closeSmtp(smtp), closeHttp(http)]);
    },
  };
}
