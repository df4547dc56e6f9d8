import { useEffect, useState } from 'react';
import { formatSi, numberFormsHint, parseSi } from '~/lib/engine/units';
import { describedBy, FieldShell, inputClass } from '../ui/FieldShell';

interface Props {
  id: string;
  label: string;
  unit: string;
  value: number | undefined;
  onChange: (value: number | undefined) => void;
  onBlur?: () => void;
  error?: string | undefined;
  hint?: string | undefined;
  /** Shown and typed as a percentage; stored as a fraction. */
  percent?: boolean;
  /** An empty field means "not given" (undefined) rather than an error. */
  optional?: boolean;
}

function show(value: number | undefined, unit: string, percent: boolean): string {
  if (value === undefined || !Number.isFinite(value)) return '';
  if (percent) return String(Number((value * 100).toPrecision(4)));
  // Plain digits for ordinary magnitudes; prefixes for the very small and very large.
  if (value === 0 || (Math.abs(value) >= 0.1 && Math.abs(value) < 10_000)) return String(Number(value.toPrecision(6)));
  return formatSi(value, unit).replace(` ${unit}`, '').replace(/ /g, '');
}

/**
 * A number field that accepts SI-prefixed input ("4k7", "220m", "3.3", "3V3", "3,3"). The
 * typed text is kept while focused; the parsed number goes to the form.
 */
export function SiNumberField({ id, label, unit, value, onChange, onBlur, error, hint, percent = false, optional = false }: Props) {
  const [text, setText] = useState(() => show(value, unit, percent));
  const [focused, setFocused] = useState(false);
  useEffect(() => {
    // What was typed and does not read stays in the box beside its error, so it can be corrected.
    if (!focused && !Number.isNaN(value)) setText(show(value, unit, percent));
  }, [value, unit, percent, focused]);
  const fieldUnit = percent ? '%' : unit;
  // Text that does not read says which forms do, once the field is left (or the form checked).
  const unreadable = text.trim() !== '' && parseSi(text, fieldUnit) === null;
  const shownError =
    unreadable && (error || !focused) ? `“${text.trim()}” does not read as a number. ${numberFormsHint(fieldUnit)}` : error;

  return (
    <FieldShell id={id} label={label} unit={fieldUnit} error={shownError} hint={hint}>
      <input
        id={id}
        inputMode="decimal"
        autoComplete="off"
        spellCheck={false}
        className={`${inputClass(shownError)} tabular-nums`}
        value={text}
        aria-invalid={shownError ? true : undefined}
        aria-describedby={describedBy(id, hint, shownError)}
        onFocus={() => setFocused(true)}
        onChange={(event) => {
          setText(event.target.value);
          if (optional && event.target.value.trim() === '') return onChange(undefined);
          const parsed = parseSi(event.target.value, fieldUnit);
          onChange(parsed === null ? Number.NaN : percent ? parsed / 100 : parsed);
        }}
        onBlur={() => {
          setFocused(false);
          onBlur?.();
        }}
      />
    </FieldShell>
  );
}
