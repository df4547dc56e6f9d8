import { useMemo } from 'react';
import type uPlot from 'uplot';
import type { Option } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { TYPICAL_NOTE } from '~/lib/review/words';
import { AXIS_STYLE, SERIES_LOOK } from './chart-styles';
import { UPlotChart, type ChartBuilder } from './UPlotChart';

type Kind = 'efficiency' | 'dissipation';

const KIND = {
  efficiency: {
    title: 'Efficiency across the input range (typical load)',
    axis: 'Efficiency, %',
    value: (o: Option) => o.curves.efficiency.map((v) => (v === null ? null : v * 100)),
    text: (v: number) => `${v.toFixed(1)} %`,
  },
  dissipation: {
    title: 'Total dissipation across the input range (highest load)',
    axis: 'Dissipation, W',
    value: (o: Option) => o.curves.dissipationW,
    text: (v: number) => formatSi(v, 'W'),
  },
} as const;

/** One line per option over the brief's input range; an option that cannot run at an input leaves a gap. */
export function CurvesChart({ options, kind }: { options: readonly Option[]; kind: Kind }) {
  const spec = KIND[kind];
  const build = useMemo<ChartBuilder>(
    () => (lib, width) => {
      const data = lib.join(options.map((o) => [o.curves.vIn, spec.value(o)] as uPlot.AlignedData));
      return {
        data,
        options: {
          width,
          height: 260,
          scales: { x: { time: false } },
          axes: [
            { ...AXIS_STYLE, label: 'Input voltage, V' },
            {
              ...AXIS_STYLE,
              label: spec.axis,
              size: 60,
              values: (_u, ticks) => ticks.map((t) => (kind === 'efficiency' ? `${t}` : formatSi(t, ''))),
            },
          ],
          legend: { markers: { dash: (_u, i) => (i === 0 ? 'solid' : SERIES_LOOK[options[i - 1]!.topology].css), width: 3 } },
          series: [
            { label: 'Input', value: (_u, v) => (v === null ? '—' : formatSi(v, 'V')) },
            ...options.map((o) => {
              const look = SERIES_LOOK[o.topology];
              return {
                label: TOPOLOGY_NAMES[o.topology],
                stroke: look.stroke,
                dash: look.dash,
                width: o.feasible ? 2.5 : 1.5,
                spanGaps: false,
                points: { show: false },
                value: (_u: uPlot, v: number | null) => (v === null ? '—' : spec.text(v)),
              };
            }),
          ],
        },
      };
    },
    [options, kind, spec],
  );
  const heading = `${kind}-chart-heading`;
  return (
    <figure aria-labelledby={heading} className="rounded-lg border border-rule bg-card p-3">
      <h3 id={heading} className="text-sm font-bold">
        {spec.title}
      </h3>
      <UPlotChart build={build} label={`${spec.title}, one line per option; the figures are in the table below.`} />
      <figcaption className="mt-1 text-xs text-ink-faint">
        Click a name in the legend to hide or show its line. Figures are {TYPICAL_NOTE}.
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
