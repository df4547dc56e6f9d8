import type { Option } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { formatMoney } from '~/lib/platform/format';
import { componentValue } from '~/lib/review/figures';
import { ROLE_NAMES, TYPICAL_NOTE } from '~/lib/review/words';

const dash = (value: number | null, unit: string) => (value === null ? '—' : formatSi(value, unit));
const pct = (value: number | null) => (value === null ? '—' : `±${Number((value * 100).toPrecision(3))} %`);

interface Props {
  option: Option;
  currency: string;
  id?: string;
  /** The part marked here and in the drawing; with `onSelect`, each reference is a button that marks its part. */
  selected?: string | null;
  onSelect?: (ref: string | null) => void;
}

/** The chosen option's parts with values, ratings and tolerances, and what each dissipates. */
export function PartList({ option, currency, id, selected = null, onSelect }: Props) {
  const heat = new Map(option.dissipation.parts.map((p) => [p.ref, p]));
  return (
    <div id={id} className="overflow-x-auto rounded-lg border border-rule bg-card">
      <table className="notebook">
        <caption className="px-3 py-2 text-left text-sm text-ink-soft">
          Part list. Worst and fault dissipation are {TYPICAL_NOTE}. Ratings follow the twice-the-stress rule (common practice).
        </caption>
        <thead>
          <tr>
            <th scope="col">Ref</th>
            <th scope="col">Role</th>
            <th scope="col">Part</th>
            <th scope="col" className="num">
              Value
            </th>
            <th scope="col" className="num">
              Rating
            </th>
            <th scope="col" className="num">
              Tolerance
            </th>
            <th scope="col" className="num">
              Worst
            </th>
            <th scope="col" className="num">
              Fault
            </th>
            <th scope="col" className="num">
              Cost
            </th>
          </tr>
        </thead>
        <tbody>
          {option.components.map((c) => {
            const p = heat.get(c.ref);
            const rating = [c.ratingW !== null ? formatSi(c.ratingW, 'W') : null, c.ratingV !== null ? formatSi(c.ratingV, 'V') : null]
              .filter(Boolean)
              .join(', ');
            const marked = selected === c.ref;
            return (
              <tr key={c.ref} data-ref={c.ref} data-selected={marked || undefined} className={marked ? 'bg-copper-50' : undefined}>
                <th scope="row" className={`border-b border-rule font-mono text-ink ${marked ? 'border-l-[6px] border-l-copper-500' : ''}`}>
                  {onSelect ? (
                    <button
                      type="button"
                      aria-pressed={marked}
                      title={`Mark ${c.ref} in the drawing and the trace`}
                      onClick={() => onSelect(marked ? null : c.ref)}
                      className="font-mono underline decoration-dotted underline-offset-4"
                    >
                      {c.ref}
                    </button>
                  ) : (
                    c.ref
                  )}
                </th>
                <td>{ROLE_NAMES[c.role]}</td>
                <td>{c.part}</td>
                <td className="num whitespace-nowrap">{componentValue(c)}</td>
                <td className="num whitespace-nowrap">{rating || '—'}</td>
                <td className="num">{pct(c.tolerance)}</td>
                <td className="num whitespace-nowrap">{p ? dash(p.maxW, 'W') : '—'}</td>
                <td className="num whitespace-nowrap">{p ? dash(p.faultW, 'W') : '—'}</td>
                <td className="num">{formatMoney(c.costCents, currency)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
