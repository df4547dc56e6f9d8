/**
 * Every route × five actors → the status the product promises (docs/api.md): 401
 * anonymous, 403 wrong role, 404 for what is not yours, never another client's
 * data. A route file without a row here fails the test.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { beforeAll, describe, expect, inject, test } from 'vitest';
import { connect } from '../../../src/lib/platform/db/connect';
import { brief, designRevision, invoice, payment, quote } from '../../../src/lib/platform/db/schema';
import { DEMO, Visitor } from '../../support/client';
import { NOTIFICATION_KINDS } from '../../../src/lib/accounts/notifications';

const baseUrl = inject('baseUrl');
const databaseUrl = inject('databaseUrl');
const ACTORS = ['anonymous', 'clientA', 'clientB', 'engineer', 'admin'] as const;
type Actor = (typeof ACTORS)[number];
type Statuses = [number, number, number, number, number];

const ids = { paidBrief: '', draftBrief: '', revision: '', quote: '', payment: '', file: '', invoice: '', invoicedQuote: '' };
const visitors = {} as Record<Actor, Visitor>;

const SPEC = {
  input: { vMin: 10.8, vNom: 12, vMax: 13.2, rippleVpp: 0.1, source: 'adapter' },
  output: { v: 5, tolerance: 0.05, iMin: 0.05, iTyp: 0.3, iMax: 0.6 },
  noise: { class: 'digital' },
  thermal: { ambientMaxC: 45, airflow: 'still-air' },
};

function upload(): FormData {
  const form = new FormData();
  form.append('kind', 'datasheet');
  form.append(
    'file',
    new Blob(['%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n'], { type: 'application/pdf' }),
    'matrix.pdf',
  );
  return form;
}

interface Row {
  method: string;
  /** The route file under src/pages, as Astro names it. */
  file: string;
  path: () => string;
  body?: () => unknown;
  form?: () => FormData;
  /** A page form's fields, posted URL-encoded as a browser does (a function when they name an id found at start). */
  fields?: Record<string, string> | (() => Record<string, string>);
  /** Signed in afresh for this row, because the row ends the session. */
  fresh?: true;
  expect: Statuses;
}

//                                                                      anon  A    B    eng  admin
const ROWS: Row[] = [
  { method: 'GET', file: 'api/health.ts', path: () => '/api/health', expect: [200, 200, 200, 200, 200] },
  { method: 'POST', file: 'api/v1/account.ts', path: () => '/api/v1/account', body: () => ({}), expect: [400, 400, 400, 400, 400] },
  { method: 'POST', file: 'api/v1/evaluate.ts', path: () => '/api/v1/evaluate', body: () => SPEC, expect: [200, 200, 200, 200, 200] },
  { method: 'GET', file: 'api/v1/briefs/index.ts', path: () => '/api/v1/briefs', expect: [401, 200, 200, 200, 200] },
  {
    method: 'POST',
    file: 'api/v1/briefs/index.ts',
    path: () => '/api/v1/briefs',
    body: () => ({ title: 'Matrix brief' }),
    expect: [401, 201, 201, 403, 403],
  },
  { method: 'GET', file: 'api/v1/briefs/[id].ts', path: () => `/api/v1/briefs/${ids.paidBrief}`, expect: [401, 200, 404, 200, 200] },
  {
    method: 'PATCH',
    file: 'api/v1/briefs/[id].ts',
    path: () => `/api/v1/briefs/${ids.draftBrief}`,
    body: () => ({ notes: 'edited' }),
    expect: [401, 200, 404, 400, 400],
  },
  // Only a draft is deleted, by its owner: client A's brief is paid (409).
  { method: 'DELETE', file: 'api/v1/briefs/[id].ts', path: () => `/api/v1/briefs/${ids.paidBrief}`, expect: [401, 409, 404, 403, 403] },
  {
    method: 'GET',
    file: 'api/v1/briefs/[id]/messages.ts',
    path: () => `/api/v1/briefs/${ids.paidBrief}/messages`,
    expect: [401, 200, 404, 200, 200],
  },
  {
    method: 'POST',
    file: 'api/v1/briefs/[id]/messages.ts',
    path: () => `/api/v1/briefs/${ids.paidBrief}/messages`,
    body: () => ({ body: 'When does the design work start?' }),
    expect: [401, 201, 404, 201, 201],
  },
  {
    method: 'POST',
    file: 'api/v1/briefs/[id]/files.ts',
    path: () => `/api/v1/briefs/${ids.paidBrief}/files`,
    form: upload,
    expect: [401, 201, 404, 201, 201],
  },
  {
    method: 'GET',
    file: 'api/v1/briefs/[id]/notes.ts',
    path: () => `/api/v1/briefs/${ids.paidBrief}/notes`,
    expect: [401, 403, 403, 200, 200],
  },
  {
    method: 'POST',
    file: 'api/v1/briefs/[id]/notes.ts',
    path: () => `/api/v1/briefs/${ids.paidBrief}/notes`,
    body: () => ({ body: 'Internal' }),
    expect: [401, 403, 403, 201, 201],
  },
  {
    method: 'GET',
    file: 'api/v1/briefs/[id]/revisions.ts',
    path: () => `/api/v1/briefs/${ids.paidBrief}/revisions`,
    expect: [401, 403, 403, 200, 200],
  },
  {
    method: 'POST',
    file: 'api/v1/briefs/[id]/revisions.ts',
    path: () => `/api/v1/briefs/${ids.paidBrief}/revisions`,
    body: () => ({ note: 'matrix' }),
    expect: [401, 403, 403, 201, 201],
  },
  { method: 'GET', file: 'api/v1/files/[id].ts', path: () => `/api/v1/files/${ids.file}`, expect: [401, 200, 404, 200, 200] },
  {
    method: 'POST',
    file: 'api/v1/payments/webhook.ts',
    path: () => '/api/v1/payments/webhook',
    body: () => ({}),
    expect: [400, 400, 400, 400, 400],
  },
  { method: 'GET', file: 'api/v1/quotes/index.ts', path: () => '/api/v1/quotes', expect: [401, 200, 200, 200, 200] },
  // Staff refund; a refund without a reason is refused before anything moves.
  {
    method: 'POST',
    file: 'api/v1/payments/[id]/refund.ts',
    path: () => `/api/v1/payments/${ids.payment}/refund`,
    body: () => ({ reason: ' ' }),
    expect: [401, 403, 403, 400, 400],
  },
  {
    method: 'POST',
    file: 'api/v1/quotes/index.ts',
    path: () => '/api/v1/quotes',
    body: () => ({ revisionId: ids.revision }),
    expect: [401, 403, 403, 409, 409],
  },
  { method: 'GET', file: 'api/v1/quotes/[id].ts', path: () => `/api/v1/quotes/${ids.quote}`, expect: [401, 200, 404, 200, 200] },
  {
    method: 'PATCH',
    file: 'api/v1/quotes/[id].ts',
    path: () => `/api/v1/quotes/${ids.quote}`,
    body: () => ({ terms: 'x' }),
    expect: [401, 403, 403, 409, 409],
  },
  {
    method: 'POST',
    file: 'api/v1/quotes/[id]/accept.ts',
    path: () => `/api/v1/quotes/${ids.quote}/accept`,
    expect: [401, 409, 404, 403, 403],
  },
  {
    method: 'POST',
    file: 'api/v1/quotes/[id]/decline.ts',
    path: () => `/api/v1/quotes/${ids.quote}/decline`,
    body: () => ({ reason: 'Over budget' }),
    expect: [401, 409, 404, 403, 403],
  },
  {
    method: 'POST',
    file: 'api/v1/quotes/[id]/checkout.ts',
    path: () => `/api/v1/quotes/${ids.quote}/checkout`,
    expect: [401, 409, 404, 403, 403],
  },
  { method: 'GET', file: 'api/v1/quotes/[id]/pdf.ts', path: () => `/api/v1/quotes/${ids.quote}/pdf`, expect: [401, 200, 404, 200, 200] },
  { method: 'POST', file: 'api/v1/quotes/[id]/send.ts', path: () => `/api/v1/quotes/${ids.quote}/send`, expect: [401, 403, 403, 409, 409] },
  {
    method: 'GET',
    file: 'api/v1/revisions/[id]/netlist.cir.ts',
    path: () => `/api/v1/revisions/${ids.revision}/netlist.cir`,
    expect: [401, 403, 403, 200, 200],
  },
  {
    method: 'GET',
    file: 'api/v1/revisions/[id]/parts.csv.ts',
    path: () => `/api/v1/revisions/${ids.revision}/parts.csv`,
    expect: [401, 403, 403, 200, 200],
  },
  {
    method: 'GET',
    file: 'api/v1/revisions/[id]/schematic.svg.ts',
    path: () => `/api/v1/revisions/${ids.revision}/schematic.svg`,
    expect: [401, 200, 404, 200, 200],
  },
  {
    method: 'GET',
    file: 'api/v1/revisions/compare.ts',
    path: () => `/api/v1/revisions/compare?a=${ids.revision}&b=${ids.revision}`,
    expect: [401, 403, 403, 200, 200],
  },
  { method: 'POST', file: 'quotes/[id]/pay.ts', path: () => `/quotes/${ids.quote}/pay`, expect: [303, 303, 404, 404, 404] },
  // Client A's balance invoice (the demo's paid-in-full job) is paid already: back to the quote page with the reason (303), 409 on the API.
  { method: 'GET', file: 'api/v1/invoices/[id].ts', path: () => `/api/v1/invoices/${ids.invoice}`, expect: [401, 200, 404, 200, 200] },
  {
    method: 'GET',
    file: 'api/v1/invoices/[id]/pdf.ts',
    path: () => `/api/v1/invoices/${ids.invoice}/pdf`,
    expect: [401, 200, 404, 200, 200],
  },
  {
    method: 'POST',
    file: 'api/v1/invoices/[id]/checkout.ts',
    path: () => `/api/v1/invoices/${ids.invoice}/checkout`,
    expect: [401, 409, 404, 403, 403],
  },
  {
    method: 'POST',
    file: 'quotes/[id]/pay-balance.ts',
    path: () => `/quotes/${ids.invoicedQuote}/pay-balance`,
    expect: [303, 303, 404, 404, 404],
  },
  { method: 'POST', file: 'sign-out.ts', path: () => '/sign-out', fresh: true, expect: [303, 303, 303, 303, 303] },
  // Page form posts: anonymous visitors are sent to sign in (303), other roles get the 403 page,
  // and fields that do not read come back with the page and a 400.
  {
    method: 'POST',
    file: 'admin/catalog.astro',
    path: () => '/admin/catalog',
    fields: { intent: 'json', id: 'thermal', params: '{' },
    expect: [303, 403, 403, 403, 400],
  },
  {
    method: 'POST',
    file: 'admin/catalog.astro',
    path: () => '/admin/catalog?class=thermal',
    fields: { intent: 'edit', id: 'thermal', 'f.tjMarginK': '-5' },
    expect: [303, 403, 403, 403, 400],
  },
  {
    method: 'POST',
    file: 'admin/catalog.astro',
    path: () => '/admin/catalog',
    fields: { intent: 'add', kind: 'heatsinks', label: 'Not a list' },
    expect: [303, 403, 403, 403, 400],
  },
  {
    method: 'POST',
    file: 'admin/catalog.astro',
    path: () => '/admin/catalog',
    fields: { intent: 'retire', id: 'switchers:no-such-class' },
    expect: [303, 403, 403, 403, 404],
  },
  {
    method: 'POST',
    file: 'admin/catalog.astro',
    path: () => '/admin/catalog',
    fields: { intent: 'copy', id: 'switchers:no-such-class', label: 'Copy' },
    expect: [303, 403, 403, 403, 404],
  },
  {
    method: 'POST',
    file: 'admin/users.astro',
    path: () => '/admin/users',
    fields: { intent: 'role', userId: '', role: 'owner' },
    expect: [303, 403, 403, 403, 400],
  },
  {
    method: 'POST',
    file: 'admin/users.astro',
    path: () => '/admin/users',
    fields: { intent: 'invite', name: 'Matrix', email: 'not an address', role: 'client' },
    expect: [303, 403, 403, 403, 400],
  },
  {
    method: 'POST',
    file: 'admin/users.astro',
    path: () => '/admin/users',
    fields: { intent: 'deactivate', userId: 'no-such-person' },
    expect: [303, 403, 403, 403, 404],
  },
  {
    method: 'POST',
    file: 'admin/users.astro',
    path: () => '/admin/users',
    fields: { intent: 'reactivate', userId: 'no-such-person' },
    expect: [303, 403, 403, 403, 404],
  },
  {
    method: 'POST',
    file: 'admin/users.astro',
    path: () => '/admin/users',
    fields: { intent: 'reset', userId: 'no-such-person' },
    expect: [303, 403, 403, 403, 404],
  },
  {
    method: 'POST',
    file: 'admin/rate-card.astro',
    path: () => '/admin/rate-card',
    fields: { hourlyRate: 'a lot' },
    expect: [303, 403, 403, 403, 400],
  },
  {
    method: 'POST',
    file: 'desk/quotes/new.astro',
    path: () => '/desk/quotes/new',
    fields: { quantity: 'two' },
    expect: [303, 403, 403, 400, 400],
  },
  {
    method: 'POST',
    file: 'desk/briefs/[id].astro',
    path: () => `/desk/briefs/${ids.paidBrief}`,
    fields: { intent: 'note', body: ' ' },
    expect: [303, 403, 403, 400, 400],
  },
  {
    method: 'POST',
    file: 'desk/quotes/[id].astro',
    path: () => `/desk/quotes/${ids.quote}`,
    fields: { intent: 'refund', paymentId: 'no-such-payment', reason: '' },
    expect: [303, 403, 403, 400, 400],
  },
  // Client A's brief is paid, so not a draft (409); client B's own list does not hold it (404); the list is the client's.
  {
    method: 'POST',
    file: 'briefs/index.astro',
    path: () => '/briefs',
    fields: { intent: 'delete', briefId: '' },
    expect: [303, 400, 400, 403, 403],
  },
  {
    method: 'POST',
    file: 'briefs/index.astro',
    path: () => '/briefs',
    fields: () => ({ intent: 'delete', briefId: ids.paidBrief }),
    expect: [303, 409, 404, 403, 403],
  },
  // Withdrawing takes the tick; without it nothing moves (400); client B cannot see the brief (404).
  {
    method: 'POST',
    file: 'briefs/[id].astro',
    path: () => `/briefs/${ids.paidBrief}`,
    fields: { intent: 'withdraw' },
    expect: [303, 400, 404, 400, 400],
  },
  // Client A's quote is paid already (409); client B may not see it (404); staff do not accept or decline for clients (403).
  {
    method: 'POST',
    file: 'quotes/[id].astro',
    path: () => `/quotes/${ids.quote}`,
    fields: { decision: 'decline', reason: 'Over budget' },
    expect: [303, 409, 404, 403, 403],
  },
  // Anyone signed in keeps their own notice choices (all ticked here, so the demo people keep every notice).
  {
    method: 'POST',
    file: 'account.astro',
    path: () => '/account',
    fields: Object.fromEntries(NOTIFICATION_KINDS.map((k) => [k.kind, 'on'])),
    expect: [303, 303, 303, 303, 303],
  },
  // Only clients keep a billing address; an address too long comes back with the page.
  {
    method: 'POST',
    file: 'account/billing.astro',
    path: () => '/account/billing',
    fields: { billingAddress: 'x'.repeat(401) },
    expect: [303, 400, 400, 403, 403],
  },
  { method: 'POST', file: 'sign-in.astro', path: () => '/sign-in', fields: { email: 'not an address' }, expect: [400, 400, 400, 400, 400] },
  { method: 'POST', file: 'sign-up.astro', path: () => '/sign-up', fields: { email: 'x' }, expect: [400, 400, 400, 400, 400] },
  { method: 'POST', file: 'forgot-password.astro', path: () => '/forgot-password', fields: {}, expect: [400, 400, 400, 400, 400] },
  { method: 'POST', file: 'reset-password.astro', path: () => '/reset-password', fields: { token: '' }, expect: [400, 400, 400, 400, 400] },
];

/** better-auth's own routes: public by design, protected by its own checks and our sign-in limit. */
const EXEMPT = new Set(['ALL api/auth/[...all].ts']);

function routeFiles(dir: string, base = dir): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return routeFiles(full, base);
    return /\.(ts|astro)$/.test(name) ? [path.relative(base, full).split(path.sep).join('/')] : [];
  });
}

/** The methods a route file answers: exported handlers in `.ts` routes, the form post a page handles. */
function declaredMethods(file: string, source: string): string[] {
  if (file.endsWith('.astro')) return /handleFormPost\(/.test(source) ? ['POST'] : [];
  return [...source.matchAll(/export const (GET|POST|PUT|PATCH|DELETE|ALL)\b/g)].map((m) => m[1] ?? '');
}

async function signedInActors(): Promise<Record<Actor, Visitor>> {
  return {
    anonymous: new Visitor(baseUrl),
    clientA: await new Visitor(baseUrl).signIn(DEMO.client),
    clientB: await new Visitor(baseUrl).signIn(DEMO.otherClient),
    engineer: await new Visitor(baseUrl).signIn(DEMO.engineer),
    admin: await new Visitor(baseUrl).signIn(DEMO.admin),
  };
}

beforeAll(async () => {
  Object.assign(visitors, await signedInActors());
  const { db, client } = connect(databaseUrl);
  const [paid] = await db.select().from(brief).where(eq(brief.title, 'Soil-moisture node, 3.3 V from one Li-ion cell'));
  const [draft] = await db.select().from(brief).where(eq(brief.title, 'Gateway logic rail, 5 V from a 12 V adapter'));
  const [revision] = await db
    .select()
    .from(designRevision)
    .where(eq(designRevision.briefId, paid?.id ?? ''));
  const [paidQuote] = await db
    .select()
    .from(quote)
    .where(eq(quote.briefId, paid?.id ?? ''));
  const [deposit] = await db
    .select()
    .from(payment)
    .where(eq(payment.quoteId, paidQuote?.id ?? ''));
  const [invoiced] = await db
    .select({ id: invoice.id, quoteId: invoice.quoteId })
    .from(invoice)
    .innerJoin(quote, eq(quote.id, invoice.quoteId))
    .innerJoin(brief, eq(brief.id, quote.briefId))
    .where(eq(brief.title, 'Field logger, 5 V from a 12 V lead-acid battery'));
  client.close();
  Object.assign(ids, {
    paidBrief: paid?.id,
    draftBrief: draft?.id,
    revision: revision?.id,
    quote: paidQuote?.id,
    payment: deposit?.id,
    invoice: invoiced?.id,
    invoicedQuote: invoiced?.quoteId,
  });
  const uploaded = await visitors.clientA.request(`/api/v1/briefs/${ids.paidBrief}/files`, { method: 'POST', body: upload() });
  ids.file = (await uploaded.json()).id;
  for (const [key, value] of Object.entries(ids)) expect(value, key).toBeTruthy();
});

describe('access matrix', () => {
  test('every route file and method has a row', () => {
    const declared = routeFiles(path.resolve('src/pages')).flatMap((file) => {
      const source = readFileSync(path.resolve('src/pages', file), 'utf8');
      // A page reads a posted body only through the one form handler, so none escapes this table.
      if (file.endsWith('.astro')) expect(source, file).not.toMatch(/request\.(formData|text|json|arrayBuffer)\(|method === 'POST'/);
      return declaredMethods(file, source).map((method) => `${method} ${file}`);
    });
    const covered = new Set([...ROWS.map((r) => `${r.method} ${r.file}`), ...EXEMPT]);
    expect(declared.filter((d) => !covered.has(d))).toEqual([]);
    expect([...covered].filter((c) => !declared.includes(c))).toEqual([]);
  });

  test.each(ROWS.map((row) => [`${row.method} /${row.file}`, row] as const))('%s', async (_name, row) => {
    const got: number[] = [];
    const who = row.fresh ? await signedInActors() : visitors;
    for (const actor of ACTORS) {
      const init: RequestInit & { json?: unknown } = { method: row.method };
      if (row.body) init.json = row.body();
      if (row.form) init.body = row.form();
      if (row.fields) {
        init.headers = { 'content-type': 'application/x-www-form-urlencoded' };
        init.body = new URLSearchParams(typeof row.fields === 'function' ? row.fields() : row.fields).toString();
      }
      const response = await who[actor].request(row.path(), init);
      got.push(response.status);
      const text = await response.text();
      if (actor === 'clientB') {
        // Client B never sees client A's things, not even their titles or ids.
        expect(text).not.toContain('Soil-moisture node');
        expect(text).not.toContain(ids.paidBrief);
      }
    }
    expect(got).toEqual(row.expect);
  });

  test('list endpoints never include another client’s briefs', async () => {
    const list = await (await visitors.clientB.request('/api/v1/briefs?pageSize=100')).json();
    expect(list.items.length).toBeGreaterThan(0);
    expect(list.items.every((b: { client: { name: string } }) => b.client.name === 'Jonas Brekke')).toBe(true);
    const search = await (await visitors.clientB.request('/api/v1/briefs?q=Soil')).json();
    expect(search.total).toBe(0);
    const quotes = await (await visitors.clientB.request('/api/v1/quotes?pageSize=100')).json();
    expect(quotes.items.every((q: { client: { name: string } }) => q.client.name === 'Jonas Brekke')).toBe(true);
    expect((await (await visitors.clientB.request('/api/v1/quotes?q=Soil')).json()).total).toBe(0);
  });

  test('pages: the quote page and the brief page of client A are 404 for client B', async () => {
    for (const page of [`/quotes/${ids.quote}`, `/briefs/${ids.paidBrief}`]) {
      const response = await visitors.clientB.request(page);
      expect(response.status, page).toBe(404);
      expect(await response.text()).not.toContain('Soil-moisture node');
    }
  });
});
