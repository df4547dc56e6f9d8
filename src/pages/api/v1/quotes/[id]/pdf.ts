import type { APIRoute } from 'astro';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { notFound, pdfResponse } from '~/lib/platform/http/responses';
import { quotePdfName } from '~/lib/quotes/render.server';
import { findQuoteFor, quotePdf } from '~/lib/quotes/quotes.server';

export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const view = await findQuoteFor(gate.user, context.params.id ?? '');
  if (!view) return notFound();
  const pdf = await quotePdf(view);
  return pdfResponse(pdf, quotePdfName(view.quote.number), context.url.searchParams.has('download'));
};
