import { useMemo } from 'react';
import type uPlot from 'uplot';
import type { Option } from '~/lib/engine/types';
import { formatSi } from '~/lib/engine/units';
import { percent, TOPOLOGY_NAMES } from '~/lib/review/option-words';
import { TYPICAL_NOTE } from '~/lib/review/words';
import { AXIS_STYLE } from './chart-styles';
import { UPlotChart, type ChartBuilder } from './UPlotChart';

interface Props {
  option: Option;
  /** The rail's target and allowed deviation (fraction), which make the tolerance band. */
  target: number;
  tolerance: number;
}

/** The Monte Carlo spread of the output voltage as a histogram, with the rail's tolerance band behind it. */
export function SpreadChart({ option, target, tolerance }: Props) {
  const { histogram, mean, sigma, draws, fractionInTolerance } = option.monteCarlo;
  const lo = target * (1 - tolerance);
  const hi = target * (1 + tolerance);
  const build = useMemo<ChartBuilder>(
    () => (lib, width) => {
      const n = histogram.counts.length;
      const step = n > 0 ? (histogram.max - histogram.min) / n : 0;
      const centres = histogram.counts.map((_, k) => histogram.min + step * (k + 0.5));
      const pad = (hi - lo) * 0.15;
      const bars = lib.paths.bars?.({ size: [0.92, Infinity], align: 0 });
      return {
        data: [centres, histogram.counts],
        options: {
          width,
          height: 240,
          scales: { x: { time: false, range: () => [Math.min(lo, histogram.min) - pad, Math.max(hi, histogram.max) + pad] } },
          axes: [
            { ...AXIS_STYLE, label: 'Output voltage, V', values: (_u, ticks) => ticks.map((t) => formatSi(t, '', 4)) },
            { ...AXIS_STYLE, label: 'Draws', size: 56 },
          ],
          legend: { show: false },
          cursor: { drag: { x: false, y: false } },
          series: [
            {},
            {
              label: 'Draws',
              stroke: '#86421b',
              fill: 'rgba(192, 103, 47, 0.55)',
              width: 1,
              points: { show: false },
              ...(bars ? { paths: bars } : {}),
            },
          ],
          hooks: {
            // The band is drawn under the bars so the spread reads against the limits.
            drawClear: [
              (u: uPlot) => {
                const { ctx, bbox } = u;
                const x0 = u.valToPos(lo, 'x', true);
                const x1 = u.valToPos(hi, 'x', true);
                ctx.save();
                ctx.fillStyle = 'rgba(35, 104, 61, 0.10)';
                ctx.fillRect(x0, bbox.top, x1 - x0, bbox.height);
                ctx.strokeStyle = '#23683d';
                ctx.setLineDash([6, 4]);
                ctx.lineWidth = 1.5;
                for (const x of [x0, x1]) {
                  ctx.beginPath();
                  ctx.moveTo(x, bbox.top);
                  ctx.lineTo(x, bbox.top + bbox.height);
                  ctx.stroke();
                }
                ctx.restore();
              },
            ],
          },
        },
      };
    },
    [histogram, lo, hi],
  );
  const title = `Output-voltage spread, ${TOPOLOGY_NAMES[option.topology]}`;
  return (
    <figure aria-labelledby="spread-heading" className="rounded-lg border border-rule bg-card p-3">
      <h3 id="spread-heading" className="text-sm font-bold">
        {title}
      </h3>
      <UPlotChart
        build={build}
        label={`${title}: histogram of ${draws} Monte Carlo draws between ${formatSi(histogram.min, 'V', 4)} and ${formatSi(histogram.max, 'V', 4)}; tolerance band ${formatSi(lo, 'V', 4)} to ${formatSi(hi, 'V', 4)}.`}
      />
      <figcaption className="mt-1 text-xs text-ink-soft">
        {draws.toLocaleString('en-GB')} draws (seed {option.monteCarlo.seed}): mean {formatSi(mean, 'V', 4)}, σ {formatSi(sigma, 'V', 3)},{' '}
        <strong>{percent(fractionInTolerance, 1)} within the tolerance band</strong> (shaded, dashed edges: {formatSi(lo, 'V', 4)} –{' '}
        {formatSi(hi, 'V', 4)}, ±{Number((tolerance * 100).toPrecision(3))} %). Part tolerances and reference spreads: {TYPICAL_NOTE}.
      </figcaption>
    </figure>
  );
}
