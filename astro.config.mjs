// @ts-check
import { defineConfig, envField } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import engineWorker from './src/integrations/engine-worker';
import staticHeaders from './src/integrations/static-headers';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), engineWorker(), staticHeaders()],
  // Origin checks are done in our own middleware for every state-changing request
  // (API included), so Astro's form-only check is left off to avoid two answers.
  security: { checkOrigin: false },
  server: { port: 4321, host: true },
  vite: { plugins: [tailwindcss()] },
  env: {
    schema: {
      DATABASE_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      DATABASE_AUTH_TOKEN: envField.string({ context: 'server', access: 'secret', optional: true }),
      BETTER_AUTH_SECRET: envField.string({ context: 'server', access: 'secret', optional: true }),
      PUBLIC_BASE_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      SMTP_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      MAIL_FROM: envField.string({ context: 'server', access: 'secret', default: 'Railwright <quotes@railwright.test>' }),
      UPLOAD_DIR: envField.string({ context: 'server', access: 'secret', optional: true }),
      SEED_DEMO: envField.string({ context: 'server', access: 'secret', optional: true }),
      STRIPE_SECRET_KEY: envField.string({ context: 'server', access: 'secret', optional: true }),
      STRIPE_API_BASE: envField.string({ context: 'server', access: 'secret', optional: true }),
      STRIPE_WEBHOOK_SECRET: envField.string({ context: 'server', access: 'secret', optional: true }),
      MAIL_FAKE_SMTP_PORT: envField.number({ context: 'server', access: 'secret', default: 2525 }),
      // The local mail catcher's HTTP API, when there is one: the admin mail log then shows what it received.
      MAIL_FAKE_HTTP_URL: envField.string({ context: 'server', access: 'secret', optional: true }),
      RATE_LIMIT_DISABLED: envField.string({ context: 'server', access: 'secret', optional: true }),
      // Proxies in front of the app whose X-Forwarded-For entries are believed; 0 trusts none (README).
      TRUSTED_PROXY_HOPS: envField.number({ context: 'server', access: 'secret', default: 0, int: true, min: 0, max: 10 }),
      // Engine threads for the evaluate route; unset means one per core but one, 0 keeps it on the event loop.
      ENGINE_THREADS: envField.number({ context: 'server', access: 'secret', optional: true, int: true, min: 0, max: 64 }),
    },
  },
});
