import type { LoadSummary } from '~/lib/briefs/load-log';
import { formatSi } from '~/lib/engine/units';

/** A small SVG trace of the load log with its mean marked; no chart library needed for one line. */
export function LoadLogPlot({ summary }: { summary: LoadSummary }) {
  const w = 320;
  const h = 90;
  const tMax = summary.points.at(-1)?.[0] || 1;
  const iMax = summary.iMaxA || 1;
  const path = summary.points
    .map(([t, i], k) => `${k ? 'L' : 'M'}${((t / tMax) * w).toFixed(1)},${(h - (i / iMax) * (h - 4)).toFixed(1)}`)
    .join(' ');
  const meanY = h - (summary.iTypA / iMax) * (h - 4);
  return (
    <figure className="mt-2">
      <svg
        viewBox={`0 0 ${w} ${h}`}
        className="h-24 w-full rounded border border-rule bg-paper"
        role="img"
        aria-label={`Load current over ${formatSi(summary.durationS, 's')}, peak ${formatSi(summary.iMaxA, 'A')}`}
      >
        <path d={path} fill="none" stroke="var(--color-copper-600)" strokeWidth="1.5" />
        <line x1="0" x2={w} y1={meanY} y2={meanY} stroke="var(--color-ink-soft)" strokeDasharray="4 3" strokeWidth="1" />
      </svg>
      <figcaption className="text-xs text-ink-faint">Dashed line: the time-weighted mean.</figcaption>
    </figure>
  );
}
