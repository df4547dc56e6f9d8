import type { Evaluation } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { clientBlocker, clientCautions, feasibilityOf, nothingBuildable, percent, TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { FEASIBILITY_LOOK } from '~/components/ui/state-look';
import { StateBadge } from '../ui/StateBadge';

export type RankingState =
  | { kind: 'incomplete'; message: string }
  | { kind: 'loading'; previous: Evaluation | null }
  | { kind: 'ready'; result: Evaluation }
  | { kind: 'failed'; message: string };

/** The indicative ranking beside the wizard; an engineer confirms it later. */
export function LiveRanking({ state }: { state: RankingState }) {
  const result = state.kind === 'ready' ? state.result : state.kind === 'loading' ? state.previous : null;
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
      {result && (
        <>
          <p className="mt-1 text-sm text-ink-soft">
            {result.recommended
              ? `${result.options.filter((o) => o.feasible).length} of ${result.options.length} ways can meet this rail.`
              : `${nothingBuildable(result.options)} An engineer can often find a way by relaxing one figure.`}
          </p>
          <ol className="mt-3 flex flex-col gap-2" aria-label="Options, best first">
            {result.options.map((option, index) => {
              const blocker = clientBlocker(option);
              return (
                <li key={option.topology} className="rounded-md border border-rule p-3" data-topology={option.topology}>
                  <div className="flex flex-wrap items-center justify-between gap-2">
                    <span className="font-semibold">
                      {index + 1}. {TOPOLOGY_NAMES[option.topology]}
                    </span>
                    <StateBadge table={FEASIBILITY_LOOK} state={feasibilityOf(option)} />
                  </div>
                  {option.feasible && (
                    <dl className="mt-1.5 grid grid-cols-3 gap-2 text-xs">
                      <div>
                        <dt className="text-ink-faint">Efficiency</dt>
                        <dd className="font-semibold tabular-nums">{percent(option.efficiency.nominal)}</dd>
                      </div>
                      <div>
                        <dt className="text-ink-faint">Heat</dt>
                        <dd className="font-semibold tabular-nums">{formatSi(option.dissipation.totalMaxW, 'W')}</dd>
                      </div>
                      <div>
                        <dt className="text-ink-faint">Ripple</dt>
                        <dd className="font-semibold tabular-nums">{formatSi(option.outputRippleVpp, 'V')}</dd>
                      </div>
                    </dl>
                  )}
                  {blocker && <p className="mt-1.5 text-xs text-ink-soft">Cannot be built: it {blocker}.</p>}
                </li>
              );
            })}
          </ol>
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
