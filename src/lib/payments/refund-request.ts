/** What staff send to refund a payment. Browser-safe: the desk's form and the API share it. */
import { z } from 'zod';

const REASON_NEEDED = 'Say why the money goes back; the client’s notice and the payment history keep it.';

export const refundRequestSchema = z.object({
  reason: z.string({ error: REASON_NEEDED }).trim().min(1, REASON_NEEDED).max(500, 'Keep the reason under 500 characters.'),
});
export type RefundRequest = z.infer<typeof refundRequestSchema>;

/** The desk's refund form: the same reason, which payment, and the deliberate tick. */
export const refundFormSchema = refundRequestSchema.extend({
  intent: z.literal('refund'),
  paymentId: z.string().min(1),
  confirm: z.literal('yes', { error: 'Tick “Yes, refund” to confirm; nothing was refunded.' }),
});
