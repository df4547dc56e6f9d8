import type { APIRoute } from 'astro';
import { chosenOf, exportFileName, findRevisionWithBrief, partListCsv, partsCurrency } from '~/lib/review/exports.server';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { conflict, notFound } from '~/lib/platform/http/responses';

/** The revision's chosen part list as CSV (values in SI units, costs in minor units). */
export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const found = await findRevisionWithBrief(context.params.id ?? '');
  if (!found) return notFound();
  const option = chosenOf(found);
  if (!option) return conflict('This revision holds no design for its chosen topology.');
  return new Response(partListCsv(option, await partsCurrency()), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${exportFileName(found.briefTitle, found.revision.number, 'csv')}"`,
      'cache-control': 'no-store',
    },
  });
};
