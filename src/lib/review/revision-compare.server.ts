/** Two saved revisions of one brief side by side, for the compare page and its API. */
import { z } from 'zod';
import type { Evaluation } from '../engine';
import { chosenOption, figureRows, inputChanges } from './compare';
import { describeField } from './field-words';
import { findRevisionWithBrief, partsCurrency } from './exports.server';
import { invalidInput, refuse, succeed, type Outcome } from '../platform/outcome';

export const compareQuerySchema = z.object({
  a: z.string({ error: 'Name the first revision (a).' }).min(1, { error: 'Name the first revision (a).' }).max(64),
  b: z.string({ error: 'Name the second revision (b).' }).min(1, { error: 'Name the second revision (b).' }).max(64),
});

export type CompareOutcome = Outcome<Awaited<ReturnType<typeof buildComparison>>>;

async function buildComparison(a: NonNullable<Awaited<ReturnType<typeof findRevisionWithBrief>>>, b: typeof a) {
  const currency = await partsCurrency();
  const side = (r: typeof a.revision) => ({
    id: r.id,
    number: r.number,
    topology: r.topology,
    note: r.note,
    createdAt: r.createdAt.toISOString(),
    input: r.input,
    result: r.result as Evaluation,
  });
  const left = side(a.revision);
  const right = side(b.revision);
  const feasible = (r: typeof left) => chosenOption(r)?.feasible ?? false;
  return {
    briefId: a.revision.briefId,
    briefTitle: a.briefTitle,
    a: { id: left.id, number: left.number, topology: left.topology, feasible: feasible(left), note: left.note, createdAt: left.createdAt },
    b: {
      id: right.id,
      number: right.number,
      topology: right.topology,
      feasible: feasible(right),
      note: right.note,
      createdAt: right.createdAt,
    },
    // Each field by its label, each value with its unit: never a stored path or a bare number.
    inputs: inputChanges(left, right).map(({ path, a, b }) => {
      const before = describeField(path, a);
      return { path, label: before.label, a: before.text, b: describeField(path, b).text };
    }),
    figures: figureRows(left, right, currency),
    /** Both designs' safety cautions: a comparison shows designs too. */
    cautions: [...(chosenOption(left)?.cautions ?? []), ...(chosenOption(right)?.cautions ?? [])],
  };
}

export async function compareRevisions(aId: string, bId: string): Promise<CompareOutcome> {
  const [a, b] = await Promise.all([findRevisionWithBrief(aId), findRevisionWithBrief(bId)]);
  if (!a || !b) return refuse('not-found', 'One of the revisions does not exist.');
  if (a.revision.briefId !== b.revision.briefId)
    return invalidInput('invalid_query', [{ path: 'b', message: 'Compare two revisions of the same brief.' }]);
  return succeed(await buildComparison(a, b));
}
