import { Fragment } from 'react';
import type { Option, Quantity, TraceEntry } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { TYPICAL_NOTE } from '~/lib/review/words';

/** Dimensionless quantities (duty cycle, ratios) read as plain numbers. */
function quantity(q: Quantity): string {
  return q.unit ? formatSi(q.value, q.unit, 4) : String(Number(q.value.toPrecision(4)));
}

/** A trace line concerns a part when it is the part's own figure, takes the part as an input, or names it. */
function concerns(entry: TraceEntry, ref: string): boolean {
  const own = (name: string) => name === ref || name.startsWith(`${ref}.`);
  return own(entry.id) || Object.keys(entry.inputs).some(own) || new RegExp(`\\b${ref}\\b`).test(entry.label);
}

/**
 * The chosen option's calculation trace as a calculation sheet: each line
 * names the figure, states the equation, substitutes the inputs and gives the result.
 * The lines that concern the `selected` part are marked.
 */
export function CalcTrace({ option, selected = null }: { option: Option; selected?: string | null }) {
  const assumptions = Object.entries(option.assumptions);
  return (
    <div className="calc-sheet">
      <ol className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-card">
        {option.trace.map((entry, index) => (
          <li
            key={entry.id}
            className={`grid grid-cols-1 gap-1 px-4 py-3 text-sm sm:grid-cols-[2.5rem_minmax(0,1fr)_auto] ${selected && concerns(entry, selected) ? 'border-l-[6px] border-l-copper-500 bg-copper-50' : ''}`}
            data-trace={entry.id}
            data-selected={(selected !== null && concerns(entry, selected)) || undefined}
          >
            <span className="font-mono text-ink-faint">{index + 1}.</span>
            <div>
              <p className="font-semibold">{entry.label}</p>
              {/* Long equations wrap anywhere rather than widen the page on a phone. */}
              <p className="mt-0.5 font-mono text-ink [overflow-wrap:anywhere]">{entry.equation}</p>
              {Object.keys(entry.inputs).length > 0 && (
                <p className="mt-0.5 text-ink-soft">
                  where{' '}
                  {Object.entries(entry.inputs).map(([name, q], k, all) => (
                    <Fragment key={name}>
                      <span className="whitespace-nowrap">
                        <span className="font-mono">{name}</span> = {quantity(q)}
                        {k < all.length - 1 ? ';' : ''}
                      </span>
                      {k < all.length - 1 ? ' ' : ''}
                    </Fragment>
                  ))}
                </p>
              )}
            </div>
            <p className="font-mono font-bold tabular-nums sm:text-right">= {quantity(entry.result)}</p>
          </li>
        ))}
      </ol>
      {assumptions.length > 0 && (
        <div className="mt-4 overflow-x-auto rounded-lg border border-rule bg-card">
          <table className="notebook">
            <caption className="px-3 py-2 text-left text-sm font-semibold text-ink-soft">Device parameters used: {TYPICAL_NOTE}</caption>
            <thead>
              <tr>
                <th scope="col">Parameter</th>
                <th scope="col" className="num">
                  Value
                </th>
                <th scope="col">Standing</th>
              </tr>
            </thead>
            <tbody>
              {assumptions.map(([name, q]) => (
                <tr key={name}>
                  <th scope="row" className="border-b border-rule font-mono font-normal text-ink">
                    {name}
                  </th>
                  <td className="num whitespace-nowrap">{quantity(q)}</td>
                  <td className="text-ink-soft">{TYPICAL_NOTE}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
