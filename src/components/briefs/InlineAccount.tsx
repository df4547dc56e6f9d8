import { useState } from 'react';
import { fieldErrors, signInSchema, signUpSchema } from '~/lib/accounts/schemas';
import { describedBy, FieldShell, inputClass } from '../ui/FieldShell';

interface Props {
  onSignedIn: (name: string) => void;
}

/** Sign-up or sign-in inside the wizard, so the typed brief is never lost to a page change. */
export function InlineAccount({ onSignedIn }: Props) {
  const [mode, setMode] = useState<'sign-up' | 'sign-in'>('sign-up');
  const [values, setValues] = useState({ name: '', company: '', email: '', password: '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  const set = (key: keyof typeof values) => (event: React.ChangeEvent<HTMLInputElement>) =>
    setValues((v) => ({ ...v, [key]: event.target.value }));

  async function submit(event: React.SyntheticEvent<HTMLFormElement>) {
    event.preventDefault();
    setFailure(null);
    const parsed = mode === 'sign-up' ? signUpSchema.safeParse(values) : signInSchema.safeParse(values);
    if (!parsed.success) {
      setErrors(fieldErrors(parsed.error));
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      const response =
        mode === 'sign-up'
          ? await fetch('/api/v1/account', {
              method: 'POST',
              headers: { 'content-type': 'application/json' },
              body: JSON.stringify(parsed.data),
            })
          : await fetch('/api/auth/sign-in/email', {
              method: 'POST',
              headers: { 'content-type': 'application/json' },
              body: JSON.stringify(parsed.data),
            });
      const body = (await response.json().catch(() => ({}))) as { message?: string; user?: { name?: string }; name?: string };
      if (!response.ok) {
        setFailure(
          response.status === 401
            ? 'That e-mail and password do not match an account.'
            : response.status === 429
              ? 'Too many attempts; wait a few minutes.'
              : (body.message ?? 'That did not work; check the fields and try again.'),
        );
        return;
      }
      onSignedIn(body.user?.name ?? body.name ?? values.name);
    } finally {
      setBusy(false);
    }
  }

  const field = (key: keyof typeof values, label: string, type = 'text', autoComplete?: string) => {
    const id = `account-${key}`;
    return (
      <FieldShell id={id} label={label} error={errors[key]}>
        <input
          id={id}
          type={type}
          autoComplete={autoComplete}
          className={inputClass(errors[key])}
          value={values[key]}
          onChange={set(key)}
          aria-invalid={errors[key] ? true : undefined}
          aria-describedby={describedBy(id, undefined, errors[key])}
        />
      </FieldShell>
    );
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex flex-col gap-3 rounded-lg border border-copper-500/40 bg-copper-50 p-4"
      aria-labelledby="account-heading"
    >
      <h3 id="account-heading" className="text-lg font-bold">
        {mode === 'sign-up' ? 'Create an account to submit' : 'Sign in to submit'}
      </h3>
      <p className="text-sm text-ink-soft">Your brief stays as you typed it.</p>
      {failure && (
        <p role="alert" className="text-sm font-medium text-stop-700">
          {failure}
        </p>
      )}
      {mode === 'sign-up' && field('name', 'Your name', 'text', 'name')}
      {mode === 'sign-up' && field('company', 'Company or lab', 'text', 'organization')}
      {field('email', 'E-mail', 'email', 'email')}
      {field('password', 'Password', 'password', mode === 'sign-up' ? 'new-password' : 'current-password')}
      <button
        disabled={busy}
        className="rounded-md border border-copper-700 bg-copper-700 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-600 disabled:opacity-50"
      >
        {mode === 'sign-up' ? 'Create account and submit' : 'Sign in and submit'}
      </button>
      <button
        type="button"
        className="text-left text-sm font-semibold text-copper-700 underline"
        onClick={() => setMode(mode === 'sign-up' ? 'sign-in' : 'sign-up')}
      >
        {mode === 'sign-up' ? 'I already have an account' : 'I need a new account'}
      </button>
    </form>
  );
}
