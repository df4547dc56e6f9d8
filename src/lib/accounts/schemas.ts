import { z } from 'zod';

/** Account forms: one schema each, used by the pages, the wizard's inline sign-up and the server. */
export const PASSWORD_MIN = 10;

export const signInSchema = z.object({
  email: z.email({ error: 'Enter the e-mail address you signed up with.' }),
  password: z.string().min(1, { error: 'Enter your password.' }).max(256),
});

export const signUpSchema = z.object({
  name: z.string().trim().min(1, { error: 'Tell us your name.' }).max(120),
  company: z.string().trim().min(1, { error: 'Tell us your company or lab.' }).max(160),
  email: z.email({ error: 'Enter an e-mail address such as name@company.com.' }),
  password: z
    .string()
    .min(PASSWORD_MIN, { error: `Use at least ${PASSWORD_MIN} characters.` })
    .max(256, { error: 'Use at most 256 characters.' }),
});

export const forgotPasswordSchema = z.object({
  email: z.email({ error: 'Enter the e-mail address of your account.' }),
});

export const resetPasswordSchema = z.object({
  token: z.string().min(1, { error: 'This reset link is incomplete; ask for a new one.' }),
  password: signUpSchema.shape.password,
});

/** First message per field, for forms that show one line under each input. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.');
    out[key] ??= issue.message;
  }
  return out;
}

/** The client's billing address, as lines; printed on their balance invoices. */
export const billingAddressSchema = z.object({
  billingAddress: z
    .string()
    .trim()
    .max(400, { error: 'Keep the address within 400 characters.' })
    .refine((text) => text.split('\n').length <= 8, { error: 'Keep the address within eight lines.' }),
});
