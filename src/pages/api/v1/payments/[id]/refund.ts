/** POST /api/v1/payments/:id/refund — staff give a paid deposit or balance back in full with `{ reason }`; the client is e-mailed. */
import { refundRequestSchema } from '~/lib/payments/refund-request';
import { paymentJson } from '~/lib/payments/history.server';
import { refundPaidPayment } from '~/lib/payments/refund.server';
import { STAFF } from '~/lib/platform/http/guard';
import { apiMutation } from '~/lib/platform/http/mutation';
import { json } from '~/lib/platform/http/responses';

export const POST = apiMutation({
  access: STAFF,
  body: refundRequestSchema,
  invalidCode: 'invalid_refund',
  run: ({ user, body, context }) => refundPaidPayment(user, context.params.id ?? '', body),
  answer: (refund) => json(paymentJson(refund), 201),
});
