import { config } from './config';

/** Absolute links for e-mails and payment redirects, from the configured public address. */
export function appUrl(path: string): string {
  return new URL(path, config.publicBaseUrl ?? 'http://localhost:4321').toString();
}
