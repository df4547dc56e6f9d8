import { useEffect, useRef, useState, type RefObject } from 'react';
import type { Option, TopologyId } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { formatMoney } from '~/lib/platform/format';
import { logAxis, logPosition, placeLabels, tradeoffPoints, type PointKind } from '~/lib/ranking/tradeoff';
import { TOPOLOGY_NAMES } from '~/lib/review/option-words';

/** Short names that fit beside a point; the table below gives the full ones. */
const SHORT: Record<TopologyId, string> = {
  shunt: 'Zener shunt',
  linear: 'Linear',
  'linear-predrop': 'Pre-drop + linear',
  buck: 'Buck',
  boost: 'Boost',
  'buck-boost': 'Buck-boost',
  'buck+linear': 'Switcher + linear',
};

const KIND_WORDS: Record<PointKind, string> = { pick: 'our pick', buildable: 'can be built', blocked: 'can’t be built' };

const INK = '#1e2329';
const COPPER = '#86421b';
const FAINT = '#6b7380';
const RULE = '#e4dfd6';
const MARGIN = { top: 16, right: 16, bottom: 44, left: 58 };
const HEIGHT = 300;
/** Average width of a 12 px Manrope character, for placing labels before they are drawn. */
const LABEL_CHAR_PX = 6.8;

const clampTo = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

function Marker({ kind, x, y }: { kind: PointKind; x: number; y: number }) {
  if (kind === 'blocked') return <rect x={x - 5} y={y - 5} width={10} height={10} fill="#ffffff" stroke={FAINT} strokeWidth={1.5} />;
  return (
    <g>
      {kind === 'pick' && <circle cx={x} cy={y} r={11} fill="none" stroke={COPPER} strokeWidth={2.5} />}
      <circle cx={x} cy={y} r={5.5} fill={kind === 'pick' ? COPPER : INK} />
    </g>
  );
}

/** Follows its box's width so labels keep their size on a phone. */
function useWidth<T extends HTMLElement>(): [RefObject<T | null>, number] {
  const box = useRef<T>(null);
  const [width, setWidth] = useState(640);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    setWidth(el.clientWidth);
    const observer = new ResizeObserver(() => setWidth(el.clientWidth));
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [box, width];
}

/** Power lost against parts cost, one point per way to build the rail: lower left is better. */
export function TradeoffPlot({
  options,
  recommended,
  currency,
}: {
  options: readonly Option[];
  recommended: TopologyId | null;
  currency: string;
}) {
  const [box, width] = useWidth<HTMLDivElement>();
  const points = tradeoffPoints(options, recommended);
  const xAxis = logAxis(points.map((p) => p.costCents));
  const yAxis = logAxis(points.map((p) => p.lossW));
  const plotW = Math.max(120, width - MARGIN.left - MARGIN.right);
  const plotH = HEIGHT - MARGIN.top - MARGIN.bottom;
  // On a narrow plot the money labels would run together: keep the 1s and 5s.
  const xTicks = plotW < 400 ? xAxis.ticks.filter((t) => Math.abs(t / 10 ** Math.floor(Math.log10(t)) - 2) > 0.01) : xAxis.ticks;
  const px = (cents: number) => MARGIN.left + logPosition(xAxis, cents) * plotW;
  const py = (w: number) => MARGIN.top + (1 - logPosition(yAxis, w)) * plotH;
  // The pick's label is placed first so it keeps the best spot; the others, top to bottom.
  const ordered = [...points].sort((a, b) => Number(b.kind === 'pick') - Number(a.kind === 'pick') || py(a.lossW) - py(b.lossW));
  const boxes = placeLabels(
    ordered.map((p) => ({ x: px(p.costCents), y: py(p.lossW), width: SHORT[p.topology].length * LABEL_CHAR_PX })),
    { left: MARGIN.left + 2, top: MARGIN.top + 2, right: MARGIN.left + plotW - 2, bottom: MARGIN.top + plotH - 2 },
  );
  const money = (cents: number) => formatMoney(cents, currency);
  return (
    <figure aria-labelledby="tradeoff-heading" className="rounded-lg border border-rule bg-card p-3">
      <h3 id="tradeoff-heading" className="text-sm font-bold">
        Power lost against parts cost
      </h3>
      <div ref={box} className="mt-1 w-full">
        <svg
          width={width}
          height={HEIGHT}
          viewBox={`0 0 ${width} ${HEIGHT}`}
          role="img"
          aria-label="Power lost against parts cost, one point per way to build the rail; the figures are in the table below."
          className="block h-auto max-w-full font-sans"
          data-tradeoff-plot
        >
          {xTicks.map((t) => (
            <g key={`x${t}`}>
              <line x1={px(t)} x2={px(t)} y1={MARGIN.top} y2={MARGIN.top + plotH} stroke={RULE} />
              <text x={px(t)} y={MARGIN.top + plotH + 16} textAnchor="middle" fontSize={11} fill={FAINT}>
                {money(t)}
              </text>
            </g>
          ))}
          {yAxis.ticks.map((t) => (
            <g key={`y${t}`}>
              <line x1={MARGIN.left} x2={MARGIN.left + plotW} y1={py(t)} y2={py(t)} stroke={RULE} />
              <text x={MARGIN.left - 6} y={py(t) + 4} textAnchor="end" fontSize={11} fill={FAINT}>
                {formatSi(t, 'W')}
              </text>
            </g>
          ))}
          <rect x={MARGIN.left} y={MARGIN.top} width={plotW} height={plotH} fill="none" stroke={INK} strokeWidth={1} />
          <text x={MARGIN.left + plotW / 2} y={HEIGHT - 6} textAnchor="middle" fontSize={12} fontWeight={600} fill={INK}>
            Parts cost (log scale)
          </text>
          <text
            x={12}
            y={MARGIN.top + plotH / 2}
            textAnchor="middle"
            fontSize={12}
            fontWeight={600}
            fill={INK}
            transform={`rotate(-90 12 ${MARGIN.top + plotH / 2})`}
          >
            Power lost (log)
          </text>
          <text x={MARGIN.left + 6} y={MARGIN.top + plotH - 6} fontSize={11} fill={FAINT}>
            ↙ less loss, less cost
          </text>
          {ordered.map((p, k) => (
            <line
              key={`lead-${p.topology}`}
              x1={px(p.costCents)}
              y1={py(p.lossW)}
              x2={clampTo(px(p.costCents), boxes[k]!.left, boxes[k]!.right)}
              y2={clampTo(py(p.lossW), boxes[k]!.top, boxes[k]!.bottom)}
              stroke={FAINT}
              strokeWidth={0.75}
            />
          ))}
          {points.map((p) => (
            <Marker key={p.topology} kind={p.kind} x={px(p.costCents)} y={py(p.lossW)} />
          ))}
          {ordered.map((p, k) => (
            <text
              key={p.topology}
              x={boxes[k]!.left}
              y={boxes[k]!.bottom - 3}
              fontSize={12}
              fontWeight={p.kind === 'pick' ? 700 : 500}
              fill={p.kind === 'blocked' ? FAINT : INK}
            >
              {SHORT[p.topology]}
            </text>
          ))}
        </svg>
      </div>
      <figcaption className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft">
        <span>
          <span aria-hidden="true" className="text-copper-700">
            ◉
          </span>{' '}
          our pick (ringed)
        </span>
        <span>
          <span aria-hidden="true">●</span> can be built
        </span>
        <span>
          <span aria-hidden="true" className="text-ink-faint">
            □
          </span>{' '}
          can’t be built (hollow, grey)
        </span>
        <span>Loss at the worst corner; costs at catalog prices.</span>
      </figcaption>
      <details className="mt-2 text-xs">
        <summary className="cursor-pointer font-semibold text-copper-700">Figures behind the plot</summary>
        <div className="mt-2 overflow-x-auto">
          <table className="notebook" data-tradeoff-table>
            <thead>
              <tr>
                <th scope="col">Way to build it</th>
                <th scope="col">Standing</th>
                <th scope="col" className="num">
                  Power lost
                </th>
                <th scope="col" className="num">
                  Parts cost
                </th>
              </tr>
            </thead>
            <tbody>
              {points.map((p) => (
                <tr key={p.topology}>
                  <th scope="row">{TOPOLOGY_NAMES[p.topology]}</th>
                  <td>{KIND_WORDS[p.kind]}</td>
                  <td className="num">{formatSi(p.lossW, 'W')}</td>
                  <td className="num">{money(p.costCents)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
