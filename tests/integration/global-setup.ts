import type { TestProject } from 'vitest/node';
import { startStack } from '../support/stack';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    mailApiUrl: string;
    stripeUrl: string;
    databaseUrl: string;
  }
}

/** One running stack (app + stand-ins, fresh database with the demo seed) for every test file. */
export default async function setup(project: TestProject) {
  const stack = await startStack();
  project.provide('baseUrl', stack.app.baseUrl);
  project.provide('mailApiUrl', stack.fakes.mailApiUrl);
  project.provide('stripeUrl', stack.fakes.stripeUrl);
  project.provide('databaseUrl', stack.app.databaseUrl);
  return async () => {
    await stack.stop();
  };
}
