/** A fresh client with a brief under review and a saved revision, so each test quotes its own rail. */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { createClient } from '@libsql/client';
import { DEMO, Visitor } from '../../support/client';

export interface QuotedRail {
  client: Visitor;
  engineer: Visitor;
  email: string;
  name: string;
  briefId: string;
  revisionId: string;
}

/** 24 V bus to 12 V at 2 A: a buck with a hot regulator and no high-voltage review. */
export const RAIL_SPEC = {
  input: { vMin: 18, vNom: 24, vMax: 36, rippleVpp: 0.2, source: 'bus' },
  output: { v: 12, tolerance: 0.03, iMin: 0.1, iTyp: 0.5, iMax: 2 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 45, airflow: 'still-air' },
};

export const CLIENT_PASSWORD = 'quote-test-password';

let counter = 0;

export async function railUnderReview(
  baseUrl: string,
  spec: object = RAIL_SPEC,
  title = 'Valve manifold, 12 V at 2 A from the 24 V bus',
): Promise<QuotedRail> {
  const tag = `${Date.now().toString(36)}${(counter++).toString(36)}`;
  const email = `buyer-${tag}@quotes.test`;
  const name = `Noor Lindqvist ${tag}`;
  const client = new Visitor(baseUrl);
  const signUp = await client.request('/api/v1/account', {
    method: 'POST',
    // Each buyer signs up from a machine of its own, as clients do.
    headers: { 'x-forwarded-for': `10.${(counter >> 16) & 255}.${(counter >> 8) & 255}.${counter & 255}` },
    json: { name, company: 'Lindqvist Telemetry', email, password: CLIENT_PASSWORD },
  });
  if (signUp.status !== 201) throw new Error(`Sign-up answered ${signUp.status}: ${await signUp.text()}`);
  const created = await client.request('/api/v1/briefs', { method: 'POST', json: { title, spec, notes: '', submit: true } });
  if (created.status !== 201) throw new Error(`Brief creation answered ${created.status}: ${await created.text()}`);
  const briefId = (await created.json()).id as string;
  const engineer = await new Visitor(baseUrl).signIn(DEMO.engineer);
  const review = await engineer.request(`/api/v1/briefs/${briefId}`, { method: 'PATCH', json: { state: 'in-review' } });
  if (review.status !== 200) throw new Error(`Moving into review answered ${review.status}: ${await review.text()}`);
  const revision = await engineer.request(`/api/v1/briefs/${briefId}/revisions`, { method: 'POST', json: { note: 'As briefed' } });
  if (revision.status !== 201) throw new Error(`Saving a revision answered ${revision.status}: ${await revision.text()}`);
  return { client, engineer, email, name, briefId, revisionId: (await revision.json()).id };
}

/** The PDF's text as poppler's pdftotext reads it: an independent parser of what we rendered. */
export function pdfText(pdf: Uint8Array): string {
  const file = path.join(mkdtempSync(path.join(tmpdir(), 'railwright-pdf-')), 'quote.pdf');
  writeFileSync(file, pdf);
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
}

/** Runs one SQL statement against the test server's database, to stand in for the passing of time. */
export async function execSql(databaseUrl: string, statement: string, args: (string | number)[]): Promise<Record<string, unknown>[]> {
  const db = createClient({ url: databaseUrl });
  try {
    return (await db.execute({ sql: statement, args })).rows as Record<string, unknown>[];
  } finally {
    db.close();
  }
}

/** What the mail catcher received for one address, newest first. */
export async function mailsTo(mailApiUrl: string, to: string): Promise<{ id: string; subject: string }[]> {
  return (await fetch(`${mailApiUrl}/messages?to=${encodeURIComponent(to)}`)).json();
}

/** One received message's plain text. */
export async function mailText(mailApiUrl: string, id: string | undefined): Promise<string> {
  return (await (await fetch(`${mailApiUrl}/messages/${id}`)).json()).text;
}
