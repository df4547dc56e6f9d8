/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    /** Always set by the middleware; null when nobody is signed in. */
    user: {
      id: string;
      name: string;
      email: string;
      role: import('./lib/platform/auth/roles').Role;
    } | null;
    session: { id: string; expiresAt: Date } | null;
    /** Set when a request failed: the reference shown to the person and written to the log. */
    errorId?: string;
  }
}
