import type { RailSpec } from '~/lib/engine/rail-spec';
import type { Evaluation } from '~/lib/engine/types';
import { rankingMatrix, type RowKey } from '~/lib/ranking/matrix';
import { PickMark } from '../ranking/RankingMatrix';
import { clientBlocker, clientCautions, nothingBuildable, TOPOLOGY_NAMES, type Feasibility } from '~/lib/review/option-words';

/** An answer of the engine with the brief it was for. */
export interface Ranked {
  result: Evaluation;
  spec: RailSpec;
}

export type RankingState =
  | { kind: 'incomplete'; message: string }
  | { kind: 'loading'; previous: Ranked | null }
  | { kind: 'ready'; ranked: Ranked }
  | { kind: 'failed'; message: string };

/** The rows a client reads, in a client's words. */
const CLIENT_ROWS: Partial<Record<RowKey, string>> = { meets: 'Works', loss: 'Power lost as heat', parts: 'Number of parts' };

const CLIENT_WORKS: Record<Feasibility, { glyph: string; text: string; className: string }> = {
  feasible: { glyph: '✓', text: 'Works', className: 'bg-ok-50 text-ok-700' },
  caution: { glyph: '!', text: 'Works, with a caution', className: 'bg-warn-50 text-warn-700' },
  blocked: { glyph: '✕', text: 'Can’t be built', className: 'bg-stop-50 text-stop-700' },
};

function Compared({ ranked }: { ranked: Ranked }) {
  const { result, spec } = ranked;
  const matrix = rankingMatrix(result, {
    railPowerW: spec.output.v * spec.output.iMax,
    rippleLimitVpp: spec.noise.maxRippleVpp,
    currency: null,
  });
  const shown = matrix.columns.map((c, k) => ({ c, k })).filter(({ c }) => c.feasibility !== 'blocked');
  const blocked = result.options.filter((o) => !o.feasible);
  return (
    <>
      {shown.length > 0 && (
        <div
          className="relative mt-3 max-w-full overflow-x-auto [contain:inline-size]"
          role="region"
          aria-label="Ways that work, compared"
          tabIndex={0}
        >
          <table
            className="w-full border-collapse text-left text-xs [&_td]:px-2 [&_td]:py-1.5 [&_th]:px-2 [&_th]:py-1.5"
            data-ranking-matrix
          >
            <caption className="sr-only">The ways that work, our pick first.</caption>
            <thead>
              <tr className="border-b-2 border-ink">
                <th scope="col" className="sticky left-0 bg-card" />
                {shown.map(({ c }) => (
                  <th
                    key={c.topology}
                    scope="col"
                    className={`min-w-28 align-bottom ${c.pick ? 'bg-copper-50' : ''}`}
                    data-column={c.topology}
                  >
                    {c.pick && <PickMark />}
                    <span className="block text-sm font-bold">{c.name}</span>
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {matrix.rows
                .filter((r) => CLIENT_ROWS[r.key])
                .map((row) => (
                  <tr key={row.key} className="border-b border-rule" data-row={row.key}>
                    <th scope="row" className="sticky left-0 bg-card align-top font-semibold">
                      {CLIENT_ROWS[row.key]}
                    </th>
                    {shown.map(({ c, k }) => {
                      const cell = row.cells[k]!;
                      const works = CLIENT_WORKS[c.feasibility];
                      return row.key === 'meets' ? (
                        <td key={c.topology} className={`align-top font-semibold ${works.className}`}>
                          <span aria-hidden="true">{works.glyph} </span>
                          {works.text}
                        </td>
                      ) : (
                        <td key={c.topology} className={`align-top tabular-nums ${c.pick ? 'bg-copper-50' : ''}`}>
                          <span className="font-semibold">{cell.text}</span>
                          {cell.note && <span className="block text-ink-soft">{cell.note}</span>}
                        </td>
                      );
                    })}
                  </tr>
                ))}
            </tbody>
          </table>
        </div>
      )}
      {blocked.length > 0 && (
        <div className="mt-3">
          <h3 className="text-sm font-bold">
            <span aria-hidden="true">✕ </span>Can’t be built as described
          </h3>
          <ul className="mt-1 flex flex-col gap-1 text-xs" aria-label="Ways that can’t be built">
            {blocked.map((o) => (
              <li key={o.topology} data-topology={o.topology}>
                <span className="font-semibold">{TOPOLOGY_NAMES[o.topology]}</span>: it {clientBlocker(o)}.
              </li>
            ))}
          </ul>
        </div>
      )}
    </>
  );
}

/** The indicative ranking beside the wizard; an engineer confirms it later. */
export function LiveRanking({ state }: { state: RankingState }) {
  const ranked = state.kind === 'ready' ? state.ranked : state.kind === 'loading' ? state.previous : null;
  const result = ranked?.result ?? null;
  // Only a way that can be built has cautions worth a client's attention (the brief's own voltage cautions always).
  const buildable = result?.options.filter((o) => o.feasible) ?? [];
  const cautions = result ? clientCautions(result.options) : [];
  return (
    <section aria-labelledby="ranking-heading" className="rounded-lg border border-rule bg-card p-4">
      <div className="flex items-baseline justify-between gap-2">
        <h2 id="ranking-heading" className="text-lg font-bold">
          Ways to build it
        </h2>
        <span className="text-xs text-ink-faint" aria-live="polite">
          {state.kind === 'loading' ? 'Updating…' : 'Indicative'}
        </span>
      </div>
      {state.kind === 'incomplete' && <p className="mt-2 text-sm text-ink-soft">{state.message}</p>}
      {state.kind === 'failed' && <p className="mt-2 text-sm text-stop-700">{state.message}</p>}
      {ranked && result && (
        <>
          <p className="mt-1 text-sm text-ink-soft">
            {result.recommended
              ? `${buildable.length} of ${result.options.length} ways work for this rail.`
              : `${nothingBuildable(result.options)} An engineer can often find a way by relaxing one figure.`}
          </p>
          <Compared ranked={ranked} />
          {cautions.length > 0 && (
            <div className="mt-3 rounded-md border border-warn-700/30 bg-warn-50 p-3" role="note">
              <h3 className="text-sm font-bold text-warn-700">
                <span aria-hidden="true">! </span>Cautions
              </h3>
              <ul className="mt-1 list-disc pl-5 text-xs text-ink">
                {cautions.map((c) => (
                  <li key={c.code}>{c.message}</li>
                ))}
              </ul>
            </div>
          )}
          <p className="mt-3 text-xs text-ink-faint">
            Figures use typical part values; an engineer confirms them against the chosen parts' data.
          </p>
        </>
      )}
    </section>
  );
}
