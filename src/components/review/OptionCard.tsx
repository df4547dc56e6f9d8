import type { Option, Severity } from '~/lib/engine/types';
import { feasibilityOf, headlineReason, TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { fixText, keyFigures } from '~/lib/review/figures';
import { TYPICAL_NOTE } from '~/lib/review/words';
import { FEASIBILITY_LOOK } from '~/components/ui/state-look';
import { StateBadge } from '../ui/StateBadge';

const SEVERITY: Record<Severity, { glyph: string; word: string; className: string }> = {
  blocker: { glyph: '✕', word: 'Blocker', className: 'text-stop-700' },
  caution: { glyph: '!', word: 'Caution', className: 'text-warn-700' },
  info: { glyph: 'i', word: 'Note', className: 'text-ink-soft' },
};

interface Props {
  option: Option;
  rank: number;
  rippleLimitVpp: number;
  currency: string;
  chosen: boolean;
  onChoose: () => void;
}

/** One designed option: its standing, its reasons and the figures an engineer weighs. */
export function OptionCard({ option, rank, rippleLimitVpp, currency, chosen, onChoose }: Props) {
  const id = `option-${option.topology.replace('+', '-')}`;
  const reason = headlineReason(option);
  return (
    <article
      aria-labelledby={`${id}-name`}
      data-topology={option.topology}
      className={`rounded-lg border bg-card p-4 ${chosen ? 'border-copper-600 ring-2 ring-copper-500/40' : 'border-rule'}`}
    >
      <div className="flex flex-wrap items-start justify-between gap-2">
        <h3 id={`${id}-name`} className="text-base font-bold">
          <span className="text-ink-faint">{rank}.</span> {TOPOLOGY_NAMES[option.topology]}
        </h3>
        <StateBadge table={FEASIBILITY_LOOK} state={feasibilityOf(option)} />
      </div>
      <p className="mt-0.5 text-xs text-ink-faint">{option.label}</p>
      {reason && <p className="mt-2 text-sm text-ink">{reason}</p>}
      {option.fixes.length > 0 && (
        <div className="mt-2 rounded-md bg-idle-50 px-3 py-2 text-sm" data-fixes>
          <p className="font-semibold">What would make it buildable</p>
          <ul className="mt-1 flex list-disc flex-col gap-0.5 pl-5">
            {option.fixes.map((fix, k) => (
              <li key={`${fix.code}-${k}`}>{fixText(fix, currency)}</li>
            ))}
          </ul>
        </div>
      )}
      <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1.5 text-sm">
        {keyFigures(option, rippleLimitVpp, currency)
          .filter((f) => f.key !== 'vOutMin' && f.key !== 'vOutMax')
          .map((f) => (
            <div key={f.key} className="flex flex-col" data-figure={f.key}>
              <dt className="text-xs text-ink-faint">
                {f.label}
                {f.typical && <span className="ml-1 rounded bg-idle-50 px-1 text-[0.65rem] font-semibold text-idle-700">typ.</span>}
              </dt>
              <dd className="font-semibold tabular-nums">{f.text}</dd>
            </div>
          ))}
      </dl>
      <p className="mt-2 text-xs text-ink-faint">typ.: {TYPICAL_NOTE}.</p>
      {option.issues.length > 0 && (
        <details className="mt-2 text-sm">
          <summary className="cursor-pointer font-semibold text-copper-700">All reasons ({option.issues.length})</summary>
          <ul className="mt-1 flex flex-col gap-1">
            {option.issues.map((issue, k) => (
              <li key={`${issue.code}-${k}`} className="flex gap-2">
                <span className={`font-bold ${SEVERITY[issue.severity].className}`}>
                  <span aria-hidden="true">{SEVERITY[issue.severity].glyph} </span>
                  {SEVERITY[issue.severity].word}:
                </span>
                <span>{issue.message}</span>
              </li>
            ))}
          </ul>
        </details>
      )}
      <div className="mt-3 flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
        <label className="flex cursor-pointer items-center gap-2 font-semibold">
          <input type="radio" name="chosen-topology" checked={chosen} onChange={onChoose} className="size-4 accent-copper-700" />
          Choose {TOPOLOGY_NAMES[option.topology]}
        </label>
        {chosen && (
          <span className="font-bold text-copper-700">
            <span aria-hidden="true">✓ </span>chosen for the revision
          </span>
        )}
      </div>
    </article>
  );
}
