import type { Option } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { formatMoney } from '~/lib/platform/format';
import { componentValue } from '~/lib/review/figures';
import { ROLE_NAMES, TYPICAL_NOTE } from '~/lib/review/words';

const dash = (value: number | null, unit: string) => (value === null ? '—' : formatSi(value, unit));
const pct = (value: number | null) => (value === null ? '—' : `±${Number((value * 100).toPrecision(3))} %`);

/** The chosen option's parts with values, ratings and tolerances, and what each dissipates. */
export function PartList({ option, currency }: { option: Option; currency: string }) {
  const heat = new Map(option.dissipation.parts.map((p) => [p.ref, p]));
  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-card">
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
            return (
              <tr key={c.ref}>
                <th scope="row" className="border-b border-rule font-mono text-ink">
                  {c.ref}
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
