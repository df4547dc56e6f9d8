import type { TopologyId } from '~/lib/engine/types';
import type { MatrixCell, MatrixColumn, RankingMatrix as Matrix, Standing } from '~/lib/ranking/matrix';
import type { Feasibility } from '~/lib/review/option-words';

/** How a cell's standing reads: a shade, and a glyph with words so the shade is never the only code. */
const STANDING_LOOK: Record<Standing, { className: string; glyph: string; words: string }> = {
  best: { className: 'bg-ok-50', glyph: '▲', words: 'best of the buildable ways' },
  between: { className: '', glyph: '', words: '' },
  worst: { className: 'bg-copper-50', glyph: '▼', words: 'least good of the buildable ways' },
  alone: { className: '', glyph: '', words: '' },
  apart: { className: 'bg-idle-50 text-idle-700', glyph: '', words: 'not compared: cannot be built' },
};

const MEETS_LOOK: Record<Feasibility, { className: string; glyph: string }> = {
  feasible: { className: 'bg-ok-50 text-ok-700', glyph: '✓' },
  caution: { className: 'bg-warn-50 text-warn-700', glyph: '!' },
  blocked: { className: 'bg-stop-50 text-stop-700', glyph: '✕' },
};

interface Props {
  matrix: Matrix;
  /** The engineer's choice for the revision, with its control; absent where nothing is chosen (the wizard). */
  choice?: { chosen: TopologyId | null; onChoose: (topology: TopologyId) => void };
  busy?: boolean;
}

function CellBody({ cell }: { cell: MatrixCell }) {
  const look = STANDING_LOOK[cell.standing];
  return (
    <>
      <span className="block font-semibold tabular-nums">
        {look.glyph && (
          <span aria-hidden="true" className={`mr-1 text-xs ${cell.standing === 'best' ? 'text-ok-700' : 'text-copper-700'}`}>
            {look.glyph}
          </span>
        )}
        {cell.text}
      </span>
      {cell.note && <span className="block text-xs text-ink-soft">{cell.note}</span>}
      {look.words && <span className="sr-only"> ({look.words})</span>}
    </>
  );
}

function Reasons({ reasons, blocked }: { reasons: string[]; blocked: boolean }) {
  return (
    <ul className="mt-1 flex flex-col gap-1">
      {reasons.map((r) => (
        <li key={r} className={blocked ? 'text-stop-700' : 'text-warn-700'}>
          <span aria-hidden="true">{blocked ? '✕ ' : '! '}</span>
          {r}
        </li>
      ))}
    </ul>
  );
}

/** The mark on the pick's column, the same on the review and in the wizard. */
export function PickMark() {
  return (
    <span className="mb-1 inline-block rounded-full bg-copper-700 px-2 py-0.5 text-xs font-bold text-white">
      <span aria-hidden="true">★ </span>Our pick
    </span>
  );
}

function ColumnHead({ column, choice }: { column: MatrixColumn; choice: Props['choice'] }) {
  return (
    <th
      scope="col"
      className={`min-w-36 align-top ${column.pick ? 'border-x-2 border-t-2 border-copper-600 bg-copper-50' : ''}`}
      data-column={column.topology}
    >
      {column.pick && <PickMark />}
      <span className="block text-sm font-bold text-ink">{column.name}</span>
      {choice && (
        <label className="mt-1.5 flex cursor-pointer items-center gap-1.5 text-xs font-semibold text-copper-700">
          <input
            type="radio"
            name="chosen-topology"
            checked={choice.chosen === column.topology}
            onChange={() => choice.onChoose(column.topology)}
            className="size-4 accent-copper-700"
            aria-label={`Choose ${column.name}`}
          />
          {choice.chosen === column.topology ? 'Chosen for the revision' : 'Choose'}
        </label>
      )}
    </th>
  );
}

/** The ways to build the rail side by side: one column each (the pick first), one row per quality. */
export function RankingMatrix({ matrix, choice, busy }: Props) {
  const { columns, rows } = matrix;
  const pickEdge = (k: number) => (columns[k]?.pick ? 'border-x-2 border-copper-600' : '');
  return (
    <div
      className="relative max-w-full overflow-x-auto [contain:inline-size] rounded-lg border border-rule bg-card"
      role="region"
      aria-label="Ways compared, scrolls sideways"
      tabIndex={0}
    >
      <table
        className="w-full border-collapse text-left text-sm [&_td]:px-2.5 [&_td]:py-2 [&_th]:px-2.5 [&_th]:py-2"
        aria-busy={busy}
        data-ranking-matrix
      >
        <caption className="sr-only">The ways to build this rail in columns, our pick first; the qualities in rows.</caption>
        <thead>
          <tr className="border-b-2 border-ink">
            <th scope="col" className="sticky left-0 z-10 w-32 min-w-32 bg-card align-bottom text-xs text-ink-soft sm:w-44 sm:min-w-44">
              Way to build it
            </th>
            {columns.map((c) => (
              <ColumnHead key={c.topology} column={c} choice={choice} />
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.key} className="border-b border-rule" data-row={row.key}>
              <th scope="row" className="sticky left-0 z-10 bg-card align-top font-semibold">
                {row.label}
                <span className="block text-xs font-normal text-ink-faint">{row.better}</span>
              </th>
              {row.cells.map((cell, k) => {
                const feasibility = columns[k]!.feasibility;
                const meets = row.key === 'meets';
                const look = meets ? MEETS_LOOK[feasibility].className : STANDING_LOOK[cell.standing].className;
                return (
                  <td
                    key={columns[k]!.topology}
                    className={`align-top ${look} ${pickEdge(k)}`}
                    data-standing={meets ? feasibility : cell.standing}
                  >
                    {meets ? (
                      <span className="font-bold">
                        <span aria-hidden="true">{MEETS_LOOK[feasibility].glyph} </span>
                        {cell.text}
                      </span>
                    ) : (
                      <CellBody cell={cell} />
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
          <tr data-row="reasons">
            <th scope="row" className="sticky left-0 z-10 bg-card align-top font-semibold">
              What stops it, or what to watch
            </th>
            {columns.map((c, k) => (
              <td key={c.topology} className={`align-top text-xs ${pickEdge(k)} ${c.pick ? 'border-b-2' : ''}`} data-reasons={c.topology}>
                {c.reasons.length === 0 && <span className="text-ink-faint">Nothing</span>}
                {c.feasibility === 'blocked' && <Reasons reasons={c.reasons.slice(0, 1)} blocked />}
                {c.feasibility === 'blocked' && c.reasons.length > 1 && (
                  <details className="mt-1">
                    <summary className="cursor-pointer font-semibold text-stop-700">
                      {c.reasons.length === 2 ? '1 more blocker' : `${c.reasons.length - 1} more blockers`}
                    </summary>
                    <Reasons reasons={c.reasons.slice(1)} blocked />
                  </details>
                )}
                {c.feasibility !== 'blocked' && c.reasons.length > 0 && (
                  <details>
                    <summary className="cursor-pointer font-semibold text-warn-700">
                      <span aria-hidden="true">! </span>
                      {c.reasons.length === 1 ? '1 caution' : `${c.reasons.length} cautions`}
                    </summary>
                    <Reasons reasons={c.reasons} blocked={false} />
                  </details>
                )}
                {c.fixes.length > 0 && (
                  <div className="mt-2" data-fixes>
                    <p className="font-semibold">What would clear it</p>
                    <ul className="mt-0.5 list-disc pl-4">
                      <li>{c.fixes[0]}</li>
                    </ul>
                    {c.fixes.length > 1 && (
                      <details className="mt-0.5">
                        <summary className="cursor-pointer font-semibold">
                          {c.fixes.length === 2 ? '1 more way' : `${c.fixes.length - 1} more ways`}
                        </summary>
                        <ul className="mt-0.5 list-disc pl-4">
                          {c.fixes.slice(1).map((f) => (
                            <li key={f}>{f}</li>
                          ))}
                        </ul>
                      </details>
                    )}
                  </div>
                )}
              </td>
            ))}
          </tr>
        </tbody>
      </table>
    </div>
  );
}

/** The key to the shading, said once under the matrix. */
export function MatrixKey() {
  return (
    <p className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
      <span>
        <span className="rounded bg-ok-50 px-1 text-ok-700">▲</span> best in its row
      </span>
      <span>
        <span className="rounded bg-copper-50 px-1 text-copper-700">▼</span> least good in its row
      </span>
      <span>
        <span className="rounded bg-idle-50 px-1">grey</span> can’t be built, so not compared
      </span>
      <span>Only the ways that can be built are compared.</span>
    </p>
  );
}
