import { useEffect, useMemo, useRef, type MouseEvent } from 'react';
import type { RailSpec } from '~/lib/engine/rail-spec';
import type { Option, TopologyId } from '~/lib/engine/types';
import { TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { drawSchematic, railFiguresOf } from '~/lib/schematic';
import '../schematic/schematic.css';

interface Props {
  options: Option[];
  chosen: Option;
  spec: RailSpec;
  /** The part reference marked in the drawing, the part list and the trace. */
  selected: string | null;
  onSelect: (ref: string | null) => void;
  onChoose: (topology: TopologyId) => void;
  /** The id of the part list: the drawing's text alternative. */
  describedBy: string;
}

/**
 * The chosen option drawn large, every candidate as a thumbnail that chooses it. Selecting a part
 * in the drawing marks it here and, through `onSelect`, in the part list and the trace.
 */
export function SchematicPanel({ options, chosen, spec, selected, onSelect, onChoose, describedBy }: Props) {
  const rail = useMemo(() => railFiguresOf(spec), [spec]);
  const large = useMemo(() => drawSchematic(chosen, rail, 'schematic-chosen').svg, [chosen, rail]);
  const thumbs = useMemo(
    () => options.map((o) => ({ option: o, svg: drawSchematic(o, rail, `schematic-${o.topology}`).svg })),
    [options, rail],
  );
  const frame = useRef<HTMLDivElement>(null);

  useEffect(() => {
    for (const g of frame.current?.querySelectorAll('[data-ref]') ?? [])
      g.toggleAttribute('data-selected', g.getAttribute('data-ref') === selected);
  }, [selected, large]);

  function pick(event: MouseEvent) {
    const ref = (event.target as Element).closest('[data-ref]')?.getAttribute('data-ref') ?? null;
    if (ref) onSelect(ref === selected ? null : ref);
  }

  return (
    <div className="flex flex-col gap-4">
      <figure className="m-0" aria-describedby={describedBy}>
        <div
          ref={frame}
          className="rw-drawing rounded-lg border border-rule"
          data-interactive=""
          data-testid="schematic-chosen"
          onClick={pick}
          dangerouslySetInnerHTML={{ __html: large }}
        />
        <figcaption className="mt-1 text-sm text-ink-soft">
          Select a part in the drawing to mark its row in the part list and its lines in the calculation trace; select a reference in the
          part list to find it here. The part list is the drawing in words.
        </figcaption>
      </figure>
      <div>
        <h4 className="text-sm font-bold">Every candidate, drawn</h4>
        <ul className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-4" aria-label="Candidate drawings">
          {thumbs.map(({ option, svg }) => {
            const isChosen = option.topology === chosen.topology;
            return (
              <li key={option.topology}>
                <button
                  type="button"
                  onClick={() => onChoose(option.topology)}
                  aria-pressed={isChosen}
                  className={`flex w-full flex-col gap-1 rounded-md bg-card p-1.5 text-left text-xs ${isChosen ? 'border-[3px] border-copper-600' : 'border border-rule hover:border-ink-faint'}`}
                >
                  <span
                    className="rw-drawing pointer-events-none"
                    data-fit=""
                    aria-hidden="true"
                    dangerouslySetInnerHTML={{ __html: svg }}
                  />
                  <span className="font-semibold">
                    {isChosen ? '✓ ' : ''}
                    {TOPOLOGY_NAMES[option.topology]}
                  </span>
                  <span className="text-ink-soft">{option.feasible ? 'Meets the brief' : 'Does not meet the brief'}</span>
                </button>
              </li>
            );
          })}
        </ul>
      </div>
    </div>
  );
}
