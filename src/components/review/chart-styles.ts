/**
 * How each option is drawn in the charts: a colour and a line pattern of its own, so
 * two options are told apart without relying on colour (the legend names them too).
 */
import type uPlot from 'uplot';
import type { TopologyId } from '~/lib/engine/types';

export interface SeriesLook {
  stroke: string;
  dash: number[];
}

export const SERIES_LOOK: Record<TopologyId, SeriesLook> = {
  shunt: { stroke: '#6b7380', dash: [1.5, 3] },
  linear: { stroke: '#1e2329', dash: [14, 4, 2, 4] },
  'linear-predrop': { stroke: '#a12a22', dash: [8, 4] },
  buck: { stroke: '#86421b', dash: [] },
  boost: { stroke: '#8a5a00', dash: [5, 2] },
  'buck-boost': { stroke: '#23683d', dash: [14, 5] },
  'buck+linear': { stroke: '#2f5d8a', dash: [12, 3, 2, 3, 2, 3] },
};

/** A way that cannot be built: its line stays for reference in the palette's faint grey. */
export const FADED = 'rgba(107, 115, 128, 0.55)';

export const AXIS_STYLE = {
  stroke: '#4a525c',
  grid: { stroke: '#ece8e0', width: 1 },
  ticks: { show: false },
  font: '12px Manrope, sans-serif',
  labelFont: '600 12px Manrope, sans-serif',
};

/** The brief's nominal input as a dotted upright under the lines, so the figures that matter most are found at a glance. */
export function drawNominal(u: uPlot, volts: number): void {
  const x = u.valToPos(volts, 'x', true);
  const { ctx, bbox } = u;
  if (!(x >= bbox.left && x <= bbox.left + bbox.width)) return;
  ctx.save();
  ctx.strokeStyle = '#c0672f';
  ctx.setLineDash([2, 4]);
  ctx.lineWidth = 1.5;
  ctx.beginPath();
  ctx.moveTo(x, bbox.top);
  ctx.lineTo(x, bbox.top + bbox.height);
  ctx.stroke();
  ctx.restore();
}
