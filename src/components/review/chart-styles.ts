/**
 * How each option is drawn in the charts: a colour and a line pattern, so two
 * options are told apart without relying on colour (the legend names them too).
 */
import type { TopologyId } from '~/lib/engine/types';

export interface SeriesLook {
  stroke: string;
  dash: number[];
  /** The same pattern as a CSS border style, for the legend's marker. */
  css: 'solid' | 'dashed' | 'dotted' | 'double';
}

export const SERIES_LOOK: Record<TopologyId, SeriesLook> = {
  shunt: { stroke: '#6b7380', dash: [2, 3], css: 'dotted' },
  linear: { stroke: '#1e2329', dash: [], css: 'solid' },
  'linear-predrop': { stroke: '#a12a22', dash: [8, 4], css: 'dashed' },
  buck: { stroke: '#86421b', dash: [], css: 'double' },
  boost: { stroke: '#8a5a00', dash: [2, 3], css: 'dotted' },
  'buck-boost': { stroke: '#23683d', dash: [8, 4], css: 'dashed' },
  'buck+linear': { stroke: '#2f5d8a', dash: [12, 3, 2, 3], css: 'dashed' },
};

export const AXIS_STYLE = {
  stroke: '#4a525c',
  grid: { stroke: '#e4dfd6', width: 1 },
  ticks: { stroke: '#e4dfd6', width: 1 },
  font: '12px Manrope, sans-serif',
  labelFont: '600 12px Manrope, sans-serif',
};
