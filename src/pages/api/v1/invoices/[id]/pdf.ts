import type { APIRoute } from 'astro';
import { invoicePdfName } from '~/lib/invoices';
import { findInvoiceFor, renderInvoicePdf } from '~/lib/invoices/index.server';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { notFound, pdfResponse } from '~/lib/platform/http/responses';

/** The invoice as a PDF, for the client whose brief it is and for staff. */
export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const view = await findInvoiceFor(gate.user, context.params.id ?? '');
  if (!view) return notFound();
  const pdf = await renderInvoicePdf(view);
  return pdfResponse(pdf, invoicePdfName(view.invoice.number), context.url.searchParams.has('download'));
};
