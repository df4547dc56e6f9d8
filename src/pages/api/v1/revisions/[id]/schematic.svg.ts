import type { APIRoute } from 'astro';
import { drawingVisibleTo, exportFileName, findRevisionWithBrief, revisionSchematic } from '~/lib/review/exports.server';
import { ANY_ROLE, guardApi } from '~/lib/platform/http/guard';
import { conflict, notFound } from '~/lib/platform/http/responses';

/** The revision's chosen design as a schematic drawing (SVG): staff, and the brief's owner once a quote for it is sent. */
export const GET: APIRoute = async (context) => {
  const gate = guardApi(context, ANY_ROLE);
  if (!gate.ok) return gate.response;
  const found = await findRevisionWithBrief(context.params.id ?? '');
  if (!found || !(await drawingVisibleTo(gate.user, found))) return notFound();
  const drawing = revisionSchematic(found);
  if (!drawing.ok) return conflict(drawing.message);
  return new Response(drawing.svg, {
    headers: {
      'content-type': 'image/svg+xml; charset=utf-8',
      'content-disposition': `attachment; filename="${exportFileName(found.briefTitle, found.revision.number, 'svg')}"`,
      'cache-control': 'private, no-store',
    },
  });
};
