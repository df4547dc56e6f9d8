import type { StateLook } from '~/components/ui/state-look';

/** What a payment is for, in words. */
export const PAYMENT_KIND_WORDS: Record<string, string> = { deposit: 'Deposit', balance: 'Balance', refund: 'Refund' };

/** How a payment's state reads on screen: word, tone and glyph, never colour alone. */
export const PAYMENT_STATE_LOOK: Record<string, StateLook> = {
  pending: { label: 'Pending', tone: 'idle', glyph: '…' },
  paid: { label: 'Paid', tone: 'ok', glyph: '✓' },
  failed: { label: 'Failed', tone: 'stop', glyph: '✕' },
  expired: { label: 'Expired', tone: 'idle', glyph: '⌛' },
  refunded: { label: 'Refunded', tone: 'warn', glyph: '↩' },
};

/** A refund row's state is always "paid" (the money went out): it reads as given back. */
export const REFUND_LOOK: StateLook = { label: 'Given back', tone: 'warn', glyph: '↩' };
