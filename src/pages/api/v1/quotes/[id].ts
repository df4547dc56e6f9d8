import type { APIRoute } from 'astro';
import { patchQuoteSchema } from '~/lib/quotes/pricing';
import { ANY_ROLE, guardApi, isStaff, STAFF } from '~/lib/platform/http/guard';
import { json, notFound } from '~/lib/platform/http/responses';
import { findQuoteFor, quoteJson, quoteOf, updateDraft } from '~/lib/quotes/quotes.server';
import { apiMutation } from '~/lib/platform/http/mutation';
import { invoiceJson, invoiceOfQuote } from '~/lib/invoices/index.server';
import { db } from '~/lib/platform/db';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const view = await findQuoteFor(gate.user, context.params.id ?? '');
  if (!view) return notFound();
  // The balance invoice, once the design is delivered.
  const invoiced = await invoiceOfQuote(db, view.quote.id);
  return json({ ...quoteJson(view, { internal: isStaff(gate.user) }), invoice: invoiced ? invoiceJson(invoiced) : null });
};

/** Edits a draft's lines, units, rates, validity, terms and note to the client; the server prices it. */
export const PATCH = apiMutation({
  access: STAFF,
  body: patchQuoteSchema,
  invalidCode: 'invalid_quote',
  run: async ({ user, body, context }) => {
    const found = await quoteOf(user, context.params.id);
    return found.ok ? updateDraft(found.value, body) : found;
  },
  answer: (view) => json(quoteJson(view, { internal: true })),
});
