import type { SyntheticEvent } from 'react';
import { describedBy, FieldShell, inputClass } from '../ui/FieldShell';
import { CHOICE_OVERRIDES, NUMBER_OVERRIDE_KEYS, NUMBER_OVERRIDES, WEIGHT_KEYS } from '~/lib/review/words';
import { WeightsControl } from '../ranking/WeightsControl';
import { REQUIREMENT_FIELDS, REQUIREMENT_KEYS, type ChoicesForm, type FormIssue, type RequirementField } from '~/lib/review/choices';
import type { RailSpec } from '~/lib/engine/rail-spec';
import { formatSi } from '~/lib/engine/units';

interface Props {
  form: ChoicesForm;
  onChange: (form: ChoicesForm) => void;
  onRun: () => void;
  running: boolean;
  dirty: boolean;
  issues: FormIssue[];
  linearClasses: { id: string; label: string }[];
  /** The client's brief: its figures are what an empty requirement field means. */
  briefed: RailSpec;
}

function briefedValue(spec: RailSpec, key: RequirementField): string {
  if (key === 'outputV') return formatSi(spec.output.v, 'V');
  if (key === 'tolerancePct') return `±${Number((spec.output.tolerance * 100).toPrecision(4))} %`;
  return formatSi(spec.noise.maxRippleVpp, 'Vpp');
}

const selectClass = 'w-full rounded-md border border-ink/25 bg-card px-3 py-2 text-base';

/** What matters most, and overrides; re-running ranks the options again without saving anything. */
export function AdjustPanel({ form, onChange, onRun, running, dirty, issues, linearClasses, briefed }: Props) {
  const errorAt = (path: string) => issues.find((i) => i.path === path)?.message;
  const known = new Set([
    ...WEIGHT_KEYS.map((k) => `weights.${k}`),
    ...NUMBER_OVERRIDE_KEYS.map((k) => `overrides.${k}`),
    ...Object.keys(CHOICE_OVERRIDES).map((k) => `overrides.${k}`),
    ...form.parts.map((_, k) => `overrides.parts.${k}`),
    ...form.parts.map((p) => `overrides.parts.${p.ref.trim().toUpperCase()}`),
    ...REQUIREMENT_KEYS.map((k) => `requirement.${k}`),
  ]);
  const other = issues.filter((i) => !known.has(i.path));
  const submit = (event: SyntheticEvent) => {
    event.preventDefault();
    onRun();
  };
  const setPart = (k: number, patch: Partial<ChoicesForm['parts'][number]>) =>
    onChange({ ...form, parts: form.parts.map((p, j) => (j === k ? { ...p, ...patch } : p)) });

  return (
    <form onSubmit={submit} aria-labelledby="adjust-heading" className="rounded-lg border border-rule bg-card p-4" noValidate>
      <h2 id="adjust-heading" className="text-xl font-bold">
        Adjust and re-run
      </h2>
      <WeightsControl weights={form.weights} onChange={(weights) => onChange({ ...form, weights })} errorAt={errorAt} rail={briefed} />

      <fieldset className="mt-5">
        <legend className="text-sm font-bold text-ink-soft">Overrides (leave empty to let the engine choose)</legend>
        <div className="mt-2 grid gap-3 sm:grid-cols-3">
          <FieldShell id="override-linearClass" label={CHOICE_OVERRIDES.linearClass.label} error={errorAt('overrides.linearClass')}>
            <select
              id="override-linearClass"
              className={selectClass}
              value={form.picks.linearClass}
              onChange={(e) => onChange({ ...form, picks: { ...form.picks, linearClass: e.target.value } })}
            >
              <option value="">Engine’s choice</option>
              {linearClasses.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.label}
                </option>
              ))}
            </select>
          </FieldShell>
          {(['passDevice', 'resistorSeries', 'toleranceRule'] as const).map((key) => (
            <FieldShell key={key} id={`override-${key}`} label={CHOICE_OVERRIDES[key].label} error={errorAt(`overrides.${key}`)}>
              <select
                id={`override-${key}`}
                className={selectClass}
                value={form.picks[key]}
                onChange={(e) => onChange({ ...form, picks: { ...form.picks, [key]: e.target.value } })}
              >
                <option value="">Engine’s choice</option>
                {CHOICE_OVERRIDES[key].options.map(([value, label]) => (
                  <option key={value} value={value}>
                    {label}
                  </option>
                ))}
              </select>
            </FieldShell>
          ))}
          {NUMBER_OVERRIDE_KEYS.map((key) => {
            const id = `override-${key}`;
            const spec = NUMBER_OVERRIDES[key];
            const error = errorAt(`overrides.${key}`);
            return (
              <FieldShell key={key} id={id} label={spec.label} unit={spec.unit || undefined} hint={spec.hint} error={error}>
                <input
                  id={id}
                  inputMode="decimal"
                  autoComplete="off"
                  spellCheck={false}
                  value={form.numbers[key]}
                  aria-invalid={error ? true : undefined}
                  aria-describedby={describedBy(id, spec.hint, error)}
                  onChange={(e) => onChange({ ...form, numbers: { ...form.numbers, [key]: e.target.value } })}
                  className={`${inputClass(error)} tabular-nums`}
                />
              </FieldShell>
            );
          })}
        </div>
      </fieldset>

      <fieldset className="mt-5">
        <legend className="text-sm font-bold text-ink-soft">Requirement agreed with the client (leave empty to design to the brief)</legend>
        <p className="mt-1 text-sm text-ink-soft">
          Change these only with the client’s agreement: the revision, the quote and its PDF state the requirement the design meets.
        </p>
        <div className="mt-2 grid gap-3 sm:grid-cols-3">
          {REQUIREMENT_KEYS.map((key) => {
            const id = `requirement-${key}`;
            const field = REQUIREMENT_FIELDS[key];
            const hint = `Brief: ${briefedValue(briefed, key)}. ${field.hint}`;
            const error = errorAt(`requirement.${key}`);
            return (
              <FieldShell key={key} id={id} label={field.label} unit={field.unit} hint={hint} error={error}>
                <input
                  id={id}
                  inputMode="decimal"
                  autoComplete="off"
                  spellCheck={false}
                  value={form.requirement[key]}
                  aria-invalid={error ? true : undefined}
                  aria-describedby={describedBy(id, hint, error)}
                  onChange={(e) => onChange({ ...form, requirement: { ...form.requirement, [key]: e.target.value } })}
                  className={`${inputClass(error)} tabular-nums`}
                />
              </FieldShell>
            );
          })}
        </div>
      </fieldset>

      <fieldset className="mt-5">
        <legend className="text-sm font-bold text-ink-soft">Forced part values (by reference, e.g. R1 = 4k7)</legend>
        <ul className="mt-2 flex flex-col gap-2">
          {form.parts.map((part, k) => {
            const error = errorAt(`overrides.parts.${k}`) ?? errorAt(`overrides.parts.${part.ref.trim().toUpperCase()}`);
            return (
              <li key={k} className="flex flex-wrap items-end gap-2">
                <div className="w-24">
                  <FieldShell id={`part-ref-${k}`} label="Reference">
                    <input
                      id={`part-ref-${k}`}
                      value={part.ref}
                      onChange={(e) => setPart(k, { ref: e.target.value })}
                      className={inputClass()}
                      autoComplete="off"
                    />
                  </FieldShell>
                </div>
                <div className="w-40">
                  <FieldShell id={`part-value-${k}`} label="Value" error={error}>
                    <input
                      id={`part-value-${k}`}
                      value={part.value}
                      inputMode="decimal"
                      aria-invalid={error ? true : undefined}
                      aria-describedby={describedBy(`part-value-${k}`, undefined, error)}
                      onChange={(e) => setPart(k, { value: e.target.value })}
                      className={`${inputClass(error)} tabular-nums`}
                      autoComplete="off"
                    />
                  </FieldShell>
                </div>
                <button
                  type="button"
                  className="rounded-md border border-ink/25 px-3 py-2 text-sm font-semibold hover:border-ink/60"
                  onClick={() => onChange({ ...form, parts: form.parts.filter((_, j) => j !== k) })}
                >
                  Remove {part.ref || 'this part'}
                </button>
              </li>
            );
          })}
        </ul>
        <button
          type="button"
          className="mt-2 rounded-md border border-ink/25 px-3 py-1.5 text-sm font-semibold hover:border-ink/60"
          onClick={() => onChange({ ...form, parts: [...form.parts, { ref: '', value: '' }] })}
        >
          Force a part value
        </button>
      </fieldset>

      {other.length > 0 && (
        <ul className="mt-4 text-sm font-medium text-stop-700" role="alert">
          {other.map((i) => (
            <li key={`${i.path}-${i.message}`}>
              <span aria-hidden="true">✕ </span>
              {i.message}
            </li>
          ))}
        </ul>
      )}
      <div className="mt-5 flex flex-wrap items-center gap-3">
        <button
          type="submit"
          disabled={running}
          className="rounded-md border border-copper-700 bg-copper-700 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-600 disabled:opacity-50"
        >
          {running ? 'Re-running…' : 'Re-run the engine'}
        </button>
        <span className="text-sm text-ink-soft" aria-live="polite">
          {dirty ? 'Changed since the last run — re-run to see the effect.' : 'The options below reflect these choices.'}
        </span>
      </div>
    </form>
  );
}
