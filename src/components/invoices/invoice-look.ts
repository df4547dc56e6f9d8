import type { StateLook } from '~/components/ui/state-look';

/** How an invoice's state reads on screen: word, tone and glyph, never colour alone. */
export const INVOICE_STATE_LOOK: Record<string, StateLook> = {
  issued: { label: 'Balance due', tone: 'warn', glyph: '¤' },
  paid: { label: 'Paid in full', tone: 'ok', glyph: '✓■' },
};
