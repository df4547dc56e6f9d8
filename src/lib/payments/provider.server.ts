import Stripe from 'stripe';
import { config } from '../platform/config';

let client: Stripe | null = null;

export class PaymentsNotConfigured extends Error {
  constructor(what: string) {
    super(`Online payment is not set up on this server: ${what} is missing.`);
  }
}

/** The real stripe SDK; STRIPE_API_BASE points it at the local stand-in in development and tests. */
export function paymentProvider(): Stripe {
  if (client) return client;
  const { secretKey, apiBase } = config.payments;
  if (!secretKey) throw new PaymentsNotConfigured('STRIPE_SECRET_KEY');
  const base = apiBase ? new URL(apiBase) : null;
  client = new Stripe(secretKey, {
    maxNetworkRetries: 2,
    timeout: 15_000,
    ...(base
      ? {
          host: base.hostname,
          port: Number(base.port || (base.protocol === 'https:' ? 443 : 80)),
          protocol: base.protocol === 'https:' ? 'https' : 'http',
        }
      : {}),
  });
  return client;
}

export function webhookSecret(): string {
  const secret = config.payments.webhookSecret;
  if (!secret) throw new PaymentsNotConfigured('STRIPE_WEBHOOK_SECRET');
  return secret;
}
