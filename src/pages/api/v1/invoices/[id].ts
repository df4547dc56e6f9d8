import type { APIRoute } from 'astro';
import { findInvoiceFor, invoiceJson } from '~/lib/invoices/index.server';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { json, notFound } from '~/lib/platform/http/responses';

/** One invoice: its figures and state, for the client whose brief it is and for staff. */
export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const view = await findInvoiceFor(gate.user, context.params.id ?? '');
  return view ? json(invoiceJson(view)) : notFound();
};
