/**
 * How each state reads on screen: a word, a tone and a glyph, so a state is
 * never told by colour alone. Shared by Astro components and React islands.
 */
export type Tone = 'ok' | 'warn' | 'stop' | 'idle' | 'accent';

export interface StateLook {
  label: string;
  tone: Tone;
  glyph: string;
}

export const BRIEF_STATE_LOOK: Record<string, StateLook> = {
  draft: { label: 'Draft', tone: 'idle', glyph: '✎' },
  submitted: { label: 'Submitted', tone: 'accent', glyph: '→' },
  'changes-requested': { label: 'Changes requested', tone: 'warn', glyph: '↩' },
  'in-review': { label: 'In review', tone: 'accent', glyph: '◔' },
  quoted: { label: 'Quoted', tone: 'warn', glyph: '¤' },
  accepted: { label: 'Accepted', tone: 'ok', glyph: '✓' },
  'deposit-paid': { label: 'Deposit paid', tone: 'ok', glyph: '✓✓' },
  'in-design': { label: 'In design', tone: 'accent', glyph: '◑' },
  delivered: { label: 'Delivered', tone: 'ok', glyph: '■' },
  'paid-in-full': { label: 'Paid in full', tone: 'ok', glyph: '✓■' },
  declined: { label: 'Declined', tone: 'stop', glyph: '✕' },
  expired: { label: 'Expired', tone: 'idle', glyph: '⌛' },
  cancelled: { label: 'Cancelled', tone: 'idle', glyph: '✕' },
};

export const FEASIBILITY_LOOK: Record<'feasible' | 'caution' | 'blocked', StateLook> = {
  feasible: { label: 'Feasible', tone: 'ok', glyph: '✓' },
  caution: { label: 'Feasible with cautions', tone: 'warn', glyph: '!' },
  blocked: { label: 'Blocked', tone: 'stop', glyph: '✕' },
};

export const TONE_CLASSES: Record<Tone, string> = {
  ok: 'bg-ok-50 text-ok-700 border-ok-700/30',
  warn: 'bg-warn-50 text-warn-700 border-warn-700/30',
  stop: 'bg-stop-50 text-stop-700 border-stop-700/30',
  idle: 'bg-idle-50 text-idle-700 border-idle-700/30',
  accent: 'bg-copper-50 text-copper-700 border-copper-700/30',
};

export function lookOf(table: Record<string, StateLook>, key: string): StateLook {
  return table[key] ?? { label: key, tone: 'idle', glyph: '·' };
}
