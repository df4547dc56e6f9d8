import type { ReactNode } from 'react';

interface Props {
  id: string;
  label: string;
  error?: string | undefined;
  hint?: string | undefined;
  unit?: string | undefined;
  children: ReactNode;
}

/** Label, control, unit, hint and error in the one arrangement every field uses. */
export function FieldShell({ id, label, error, hint, unit, children }: Props) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <div className="flex items-center gap-2">
        {children}
        {unit && <span className="min-w-8 text-sm text-ink-soft">{unit}</span>}
      </div>
      {hint && (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-sm font-medium text-stop-700">
          <span aria-hidden="true">✕ </span>
          {error}
        </p>
      )}
    </div>
  );
}

export const inputClass = (error?: string) =>
  `w-full rounded-md border bg-card px-3 py-2 text-base text-ink ${error ? 'border-stop-700' : 'border-ink/25'} focus:border-copper-500`;

export function describedBy(id: string, hint?: string, error?: string): string | undefined {
  return [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
}
