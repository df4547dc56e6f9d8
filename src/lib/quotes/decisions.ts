/** What a client sends when accepting or declining a quote. Browser-safe: the page's form and the API share these. */
import { z } from 'zod';

export const PURCHASE_ORDER_MAX = 40;
export const DECLINE_REASON_MAX = 2000;

const purchaseOrder = z
  .string()
  .trim()
  .max(PURCHASE_ORDER_MAX, `Keep the purchase-order number within ${PURCHASE_ORDER_MAX} characters.`)
  .regex(/^[^\p{Cc}]*$/u, 'The purchase-order number is one line of text.');

export const acceptQuoteSchema = z.object({ purchaseOrder: purchaseOrder.optional() });
export type AcceptQuoteRequest = z.infer<typeof acceptQuoteSchema>;

export const declineQuoteSchema = z.object({
  reason: z
    .string({ error: 'Tell us why you are declining, so we can do better next time.' })
    .trim()
    .min(1, 'Tell us why you are declining, so we can do better next time.')
    .max(DECLINE_REASON_MAX, `Keep the reason within ${DECLINE_REASON_MAX} characters.`),
});
export type DeclineQuoteRequest = z.infer<typeof declineQuoteSchema>;

/** The quote page's form: which decision, and its field. */
export const quoteDecisionFormSchema = z.discriminatedUnion('decision', [
  acceptQuoteSchema.extend({ decision: z.literal('accept') }),
  declineQuoteSchema.extend({ decision: z.literal('decline') }),
]);
