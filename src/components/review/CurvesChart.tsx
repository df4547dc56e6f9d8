import { useMemo } from 'react';
import type uPlot from 'uplot';
import type { Option, TopologyId } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { logTicks } from '~/lib/ranking/tradeoff';
import { TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { TYPICAL_NOTE } from '~/lib/review/words';
import { AXIS_STYLE, drawNominal, FADED, SERIES_LOOK } from './chart-styles';
import { UPlotChart, type ChartBuilder } from './UPlotChart';

type Kind = 'efficiency' | 'dissipation';

const KIND = {
  efficiency: {
    title: 'Efficiency across the input range (typical load)',
    axis: 'Efficiency, %',
    distr: 1,
    value: (o: Option) => o.curves.efficiency.map((v) => (v === null ? null : v * 100)),
    text: (v: number) => `${v.toFixed(1)} %`,
  },
  dissipation: {
    title: 'Power lost across the input range (highest load)',
    axis: 'Power lost, W (log)',
    // Losses of the ways to build one rail differ by decades: a log axis keeps the small ones readable.
    distr: 3,
    value: (o: Option) => o.curves.dissipationW,
    text: (v: number) => formatSi(v, 'W'),
  },
} as const;

interface Props {
  /** In the order the ranking shows them, the pick first. */
  options: readonly Option[];
  kind: Kind;
  pick: TopologyId | null;
  /** The brief's nominal input, marked across the plot. */
  nominalV: number;
}

/** A line's pattern and colour as a small sample, for the legend under the chart. */
function LineSample({ option }: { option: Option }) {
  const look = SERIES_LOOK[option.topology];
  return (
    <svg width="28" height="10" aria-hidden="true" className="shrink-0">
      <line
        x1="1"
        x2="27"
        y1="5"
        y2="5"
        stroke={option.feasible ? look.stroke : FADED}
        strokeWidth={option.feasible ? 2.5 : 1.5}
        strokeDasharray={look.dash.join(' ')}
      />
    </svg>
  );
}

/** One line per option over the brief's input range; an option that cannot run at an input leaves a gap. */
export function CurvesChart({ options, kind, pick, nominalV }: Props) {
  const spec = KIND[kind];
  const build = useMemo<ChartBuilder>(
    () => (lib, width) => {
      const plotted = (o: Option) => spec.value(o).map((v) => (spec.distr === 3 && v !== null && v <= 0 ? null : v));
      const data = lib.join(options.map((o) => [o.curves.vIn, plotted(o)] as uPlot.AlignedData));
      return {
        data,
        options: {
          width,
          height: 260,
          scales: { x: { time: false }, y: { distr: spec.distr } },
          axes: [
            { ...AXIS_STYLE, label: 'Input voltage, V' },
            {
              ...AXIS_STYLE,
              label: spec.axis,
              size: 60,
              values: (_u, ticks) => ticks.map((t) => (kind === 'efficiency' ? `${t}` : formatSi(t, ''))),
              ...(spec.distr === 3 ? { splits: (_u: uPlot, _axis: number, min: number, max: number) => logTicks(min, max) } : {}),
            },
          ],
          legend: { show: false },
          hooks: { drawClear: [(u: uPlot) => drawNominal(u, nominalV)] },
          series: [
            { label: 'Input', value: (_u, v) => (v === null ? '—' : formatSi(v, 'V')) },
            ...options.map((o) => {
              const look = SERIES_LOOK[o.topology];
              return {
                label: TOPOLOGY_NAMES[o.topology],
                // A way that cannot be built stays visible for reference, faded and thin.
                stroke: o.feasible ? look.stroke : FADED,
                dash: look.dash,
                width: o.topology === pick ? 3.5 : o.feasible ? 2 : 1.25,
                spanGaps: false,
                points: { show: false },
                value: (_u: uPlot, v: number | null) => (v === null ? '—' : spec.text(v)),
              };
            }),
          ],
        },
      };
    },
    [options, kind, spec, pick, nominalV],
  );
  const heading = `${kind}-chart-heading`;
  return (
    <figure aria-labelledby={heading} className="rounded-lg border border-rule bg-card p-3">
      <h3 id={heading} className="text-sm font-bold">
        {spec.title}
      </h3>
      <UPlotChart build={build} label={`${spec.title}, one line per option; the figures are in the table below.`} />
      <figcaption className="mt-1 text-xs text-ink-soft">
        <ul className="flex flex-wrap gap-x-4 gap-y-1" aria-label="Lines">
          {options.map((o) => (
            <li key={o.topology} className={`flex items-center gap-1.5 ${o.feasible ? '' : 'text-ink-faint'}`}>
              <LineSample option={o} />
              {TOPOLOGY_NAMES[o.topology]}
              {o.topology === pick ? ' (our pick)' : o.feasible ? '' : ' (can’t be built)'}
            </li>
          ))}
        </ul>
        <p className="mt-1 text-ink-faint">
          Dotted upright: the brief’s nominal input, {formatSi(nominalV, 'V')}. Figures are {TYPICAL_NOTE}.
        </p>
      </figcaption>
      <details className="mt-2 text-xs">
        <summary className="cursor-pointer font-semibold text-copper-700">Figures behind the chart</summary>
        <div className="mt-2 overflow-x-auto">
          <table className="notebook">
            <thead>
              <tr>
                <th scope="col">Input</th>
                {options.map((o) => (
                  <th key={o.topology} scope="col" className="num">
                    {TOPOLOGY_NAMES[o.topology]}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {(options[0]?.curves.vIn ?? []).map((vIn, k) => (
                <tr key={vIn}>
                  <th scope="row">{formatSi(vIn, 'V')}</th>
                  {options.map((o) => {
                    const v = spec.value(o)[k];
                    return (
                      <td key={o.topology} className="num">
                        {v === null || v === undefined ? '—' : spec.text(v)}
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
