import type { StateLook } from '~/components/ui/state-look';

/** How a quote's state reads on screen: word, tone and glyph, never colour alone. */
export const QUOTE_STATE_LOOK: Record<string, StateLook> = {
  draft: { label: 'Draft', tone: 'idle', glyph: '✎' },
  sent: { label: 'Sent', tone: 'accent', glyph: '→' },
  accepted: { label: 'Accepted', tone: 'ok', glyph: '✓' },
  'deposit-paid': { label: 'Deposit paid', tone: 'ok', glyph: '✓✓' },
  declined: { label: 'Declined', tone: 'stop', glyph: '⊘' },
  expired: { label: 'Expired', tone: 'idle', glyph: '⌛' },
  withdrawn: { label: 'Withdrawn', tone: 'stop', glyph: '✕' },
};
