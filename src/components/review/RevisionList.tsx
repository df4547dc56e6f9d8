import { useState } from 'react';
import type { TopologyId } from '~/lib/engine/types';
import { LocalTime } from '../ui/LocalTime';
import { TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { FeasibilityMark } from './FeasibilityMark';

export interface RevisionSummary {
  id: string;
  number: number;
  topology: string;
  /** Whether the chosen design meets the brief; a quote from one that does not needs a reason. */
  feasible: boolean;
  note: string;
  createdAt: string;
  author: string | null;
}

const selectClass = 'rounded-md border border-ink/25 bg-card px-3 py-2 text-sm';

/** Saved revisions, newest first, each with its feasibility, sheet, exports and a way to quote it; any two can be compared. */
export function RevisionList({ briefId, revisions }: { briefId: string; revisions: RevisionSummary[] }) {
  const [a, setA] = useState(revisions[1]?.id ?? '');
  const [b, setB] = useState(revisions[0]?.id ?? '');
  const known = (id: string) => revisions.some((r) => r.id === id);
  const left = known(a) ? a : (revisions[1]?.id ?? '');
  const right = known(b) ? b : (revisions[0]?.id ?? '');
  return (
    <section aria-labelledby="revisions-heading">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="revisions-heading" className="text-xl font-bold">
          Revisions
        </h2>
        {revisions.length > 0 && (
          <a href={`/desk/quotes/new?briefId=${briefId}`} className="text-sm font-semibold" data-testid="draft-quote">
            Draft a quote
          </a>
        )}
      </div>
      {revisions.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">No revision saved yet. Adjust, re-run, choose an option and save it with a note.</p>
      ) : (
        <ol
          className="mt-3 flex flex-col divide-y divide-rule rounded-lg border border-rule bg-card"
          aria-label="Saved revisions, newest first"
        >
          {revisions.map((r) => (
            <li key={r.id} className="grid gap-1 p-3 text-sm sm:grid-cols-[5rem_1fr_auto]" data-revision={r.number}>
              <span className="font-bold">Rev. {r.number}</span>
              <div>
                <p className="font-semibold">{TOPOLOGY_NAMES[r.topology as TopologyId] ?? r.topology}</p>
                <p data-feasible={String(r.feasible)}>
                  <FeasibilityMark feasible={r.feasible} />
                </p>
                <p className="text-ink-soft">
                  <LocalTime at={r.createdAt} />
                  {r.author ? ` · ${r.author}` : ''}
                </p>
                {r.note && <p className="mt-1 whitespace-pre-line">“{r.note}”</p>}
              </div>
              <div className="flex flex-col gap-1 sm:items-end">
                <a href={`/desk/briefs/${briefId}/revisions/${r.id}`} className="font-semibold">
                  Calculation sheet and netlist
                  <span className="sr-only"> of revision {r.number}</span>
                </a>
                <a href={`/api/v1/revisions/${r.id}/parts.csv`} download>
                  Part list (CSV)<span className="sr-only"> of revision {r.number}</span>
                </a>
                <a href={`/desk/quotes/new?revisionId=${r.id}`}>
                  Draft a quote from it<span className="sr-only"> (revision {r.number})</span>
                </a>
                <a href={`/desk/briefs/${briefId}?from=${r.id}#adjust-heading`}>
                  Start from its choices<span className="sr-only"> (revision {r.number})</span>
                </a>
              </div>
            </li>
          ))}
        </ol>
      )}
      {revisions.length >= 2 && (
        <form
          method="get"
          action={`/desk/briefs/${briefId}/compare`}
          className="mt-3 flex flex-wrap items-end gap-2"
          aria-label="Compare two revisions"
        >
          <RevisionSelect id="compare-a" name="a" label="Compare" value={left} onChange={setA} revisions={revisions} />
          <RevisionSelect id="compare-b" name="b" label="with" value={right} onChange={setB} revisions={revisions} />
          <button className="rounded-md border border-ink/25 bg-card px-4 py-2 text-sm font-semibold hover:border-ink/60">
            Compare side by side
          </button>
        </form>
      )}
    </section>
  );
}

/** One side of the compare form: a labelled choice among the brief's revisions. */
function RevisionSelect(props: {
  id: string;
  name: string;
  label: string;
  value: string;
  onChange: (id: string) => void;
  revisions: readonly { id: string; number: number }[];
}) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={props.id} className="text-sm font-semibold">
        {props.label}
      </label>
      <select id={props.id} name={props.name} value={props.value} onChange={(e) => props.onChange(e.target.value)} className={selectClass}>
        {props.revisions.map((r) => (
          <option key={r.id} value={r.id}>
            Revision {r.number}
          </option>
        ))}
      </select>
    </div>
  );
}
