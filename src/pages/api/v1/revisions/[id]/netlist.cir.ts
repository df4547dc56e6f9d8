import type { APIRoute } from 'astro';
import { exportFileName, findRevisionWithBrief, revisionNetlist } from '~/lib/review/exports.server';
import { guardApi, STAFF } from '~/lib/platform/http/guard';
import { conflict, notFound } from '~/lib/platform/http/responses';

/** The revision's chosen design as a SPICE netlist (plain text, ngspice dialect). */
export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, STAFF);
  if (!gate.ok) return gate.response;
  const found = await findRevisionWithBrief(context.params.id ?? '');
  if (!found) return notFound();
  const netlist = await revisionNetlist(found);
  if (!netlist.ok) return conflict(netlist.message);
  return new Response(netlist.text, {
    headers: {
      'content-type': 'text/plain; charset=utf-8',
      'content-disposition': `attachment; filename="${exportFileName(found.briefTitle, found.revision.number, 'cir')}"`,
      'cache-control': 'no-store',
    },
  });
};
