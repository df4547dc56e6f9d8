import { zodResolver } from '@hookform/resolvers/zod';
import { lazy, Suspense, useCallback, useEffect, useRef, useState } from 'react';
import { Controller, useForm, useWatch, type FieldPath } from 'react-hook-form';
import { noiseClasses } from '~/lib/engine/rail-spec';
import { formatSi } from '~/lib/engine/units';
import type { LoadSummary } from '~/lib/briefs/load-log';
import {
  AIRFLOW_WORDS,
  NOISE_CLASS_WORDS,
  rippleDefault,
  SOURCE_TYPICAL,
  startingBrief,
  type SourceKind,
} from '~/lib/briefs/wizard-defaults';
import { WIZARD_STEPS, wizardFormSchema, type WizardInput, type WizardOutput } from '~/lib/briefs/wizard-form';
import { FieldShell, inputClass } from '../ui/FieldShell';
import { LiveRanking } from './LiveRanking';
import { SiNumberField } from './SiNumberField';
import { guessKind, uploadFile, type UploadKind } from './uploads';
import { useLiveRanking } from './useLiveRanking';

// Shown only to some visitors at some moments: loaded when first needed.
const InlineAccount = lazy(() => import('./InlineAccount').then((m) => ({ default: m.InlineAccount })));
const LoadLogPlot = lazy(() => import('./LoadLogPlot').then((m) => ({ default: m.LoadLogPlot })));

interface Props {
  signedIn: boolean;
  draft: { id: string; title: string; notes: string; spec: Record<string, unknown> } | null;
  /** The brief came back from the consultancy with a request for changes (shown above the wizard). */
  changesRequested?: boolean;
}

interface QueuedFile {
  key: string;
  file: File;
  kind: UploadKind;
  progress: number;
  state: 'waiting' | 'uploading' | 'done' | 'failed';
  error?: string;
  loadSummary?: LoadSummary;
  loadError?: string;
}

const LOCAL_KEY = 'railwright:wizard-draft';

// Figures checked against each other (lowest ≤ nominal ≤ highest): a change to one re-checks the
// others, so an order error shows beside the fields while they are being typed.
const INPUT_RANGE = ['spec.input.vMin', 'spec.input.vNom', 'spec.input.vMax', 'spec.input.rippleVpp'] as const;
const LOAD_RANGE = ['spec.output.iMin', 'spec.output.iTyp', 'spec.output.iMax'] as const;
function relatedFields(name: FieldPath<WizardInput>): FieldPath<WizardInput>[] {
  const group = [INPUT_RANGE, LOAD_RANGE].find((g) => (g as readonly string[]).includes(name)) ?? [];
  return group.filter((other) => other !== name);
}
const SAVE_DEBOUNCE_MS = 1200;

function initialValues(draft: Props['draft']): WizardInput {
  const base = startingBrief();
  if (draft) {
    const spec = draft.spec as Partial<WizardInput['spec']>;
    return {
      title: draft.title,
      notes: draft.notes,
      spec: {
        ...base,
        ...spec,
        input: { ...base.input, ...spec.input },
        output: { ...base.output, ...spec.output },
        noise: { ...base.noise, ...spec.noise },
        thermal: { ...base.thermal, ...spec.thermal },
      },
    };
  }
  return { title: '', notes: '', spec: base };
}

/** The client's brief, step by step, with the live ranking beside it. */
export default function BriefWizard({ signedIn: signedInAtStart, draft, changesRequested = false }: Props) {
  const [step, setStep] = useState(0);
  const [signedIn, setSignedIn] = useState(signedInAtStart);
  const [draftId, setDraftId] = useState<string | null>(draft?.id ?? null);
  const [saveNote, setSaveNote] = useState<string>(
    changesRequested
      ? 'The consultancy asked for changes (their message is above): edit the brief and submit it again.'
      : draft
        ? 'Draft restored.'
        : '',
  );
  const [askAccount, setAskAccount] = useState(false);
  const [submitting, setSubmitting] = useState(false);
  const [submitError, setSubmitError] = useState<string | null>(null);
  const [files, setFiles] = useState<QueuedFile[]>([]);
  const headingRef = useRef<HTMLHeadingElement>(null);

  const form = useForm<WizardInput, unknown, WizardOutput>({
    resolver: zodResolver(wizardFormSchema),
    defaultValues: initialValues(draft),
    mode: 'onTouched',
  });
  const { control, register, formState, trigger, getValues, setValue, reset } = form;
  // Read while rendering so the form tracks it: no draft is stored until the client has typed something.
  const { isDirty } = formState;
  const values = useWatch({ control });
  const ranking = useLiveRanking(values.spec);

  // Anonymous visitors keep their brief in this browser until they sign up.
  useEffect(() => {
    if (signedInAtStart || draft) return;
    const saved = window.localStorage.getItem(LOCAL_KEY);
    if (!saved) return;
    try {
      reset(JSON.parse(saved) as WizardInput);
      setSaveNote('Restored what you typed last time.');
    } catch {
      window.localStorage.removeItem(LOCAL_KEY);
    }
  }, [signedInAtStart, draft, reset]);

  // One creation at a time: autosave and submit may both ask for the draft at once.
  const creating = useRef<Promise<string> | null>(null);
  const ensureDraft = useCallback((): Promise<string> => {
    if (draftId) return Promise.resolve(draftId);
    creating.current ??= (async () => {
      const current = getValues();
      const response = await fetch('/api/v1/briefs', {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ title: current.title.trim() || undefined, notes: current.notes, spec: current.spec, submit: false }),
      });
      if (!response.ok) {
        creating.current = null;
        throw new Error('The draft could not be saved.');
      }
      const created = (await response.json()) as { id: string };
      setDraftId(created.id);
      window.history.replaceState(null, '', `/briefs/new?draft=${created.id}`);
      return created.id;
    })();
    return creating.current;
  }, [draftId, getValues]);

  // Autosave: to the server when signed in, to this browser otherwise.
  const serialized = JSON.stringify(values);
  useEffect(() => {
    if (!draftId && !isDirty) return;
    const timer = setTimeout(async () => {
      if (!signedIn) {
        window.localStorage.setItem(LOCAL_KEY, serialized);
        setSaveNote('Kept in this browser. Sign in to keep it anywhere.');
        return;
      }
      try {
        const current = getValues();
        if (!draftId) {
          await ensureDraft();
        } else {
          const response = await fetch(`/api/v1/briefs/${draftId}`, {
            method: 'PATCH',
            headers: { 'content-type': 'application/json' },
            body: JSON.stringify({
              ...(current.title.trim() ? { title: current.title.trim() } : {}),
              notes: current.notes,
              spec: current.spec,
            }),
          });
          if (!response.ok) throw new Error(String(response.status));
        }
        setSaveNote(`Draft saved ${new Date().toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}.`);
      } catch {
        setSaveNote('The draft could not be saved just now; it will be retried as you type.');
      }
    }, SAVE_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [serialized, signedIn, draftId, isDirty, ensureDraft, getValues]);

  const uploadQueued = useCallback(async (briefId: string, queue: QueuedFile[]) => {
    for (const item of queue) {
      if (item.state === 'done') continue;
      const update = (patch: Partial<QueuedFile>) => setFiles((all) => all.map((f) => (f.key === item.key ? { ...f, ...patch } : f)));
      update({ state: 'uploading', progress: 0 });
      try {
        await uploadFile(briefId, item.file, item.kind, (progress) => update({ progress }));
        update({ state: 'done', progress: 1 });
      } catch (error) {
        update({ state: 'failed', error: (error as Error).message });
        throw error;
      }
    }
  }, []);

  async function addFiles(list: FileList | null) {
    if (!list) return;
    const added: QueuedFile[] = [];
    for (const file of Array.from(list)) {
      const kind = guessKind(file);
      const item: QueuedFile = { key: `${file.name}-${file.size}-${Math.random()}`, file, kind, progress: 0, state: 'waiting' };
      if (kind === 'load-log') {
        // The CSV parser is loaded only when someone attaches a log.
        const { reduceLoadLog } = await import('~/lib/briefs/load-log');
        const reduced = reduceLoadLog(await file.text());
        if (reduced.ok) item.loadSummary = reduced.summary;
        else item.loadError = reduced.message;
      }
      added.push(item);
    }
    setFiles((all) => [...all, ...added]);
    if (signedIn) {
      try {
        await uploadQueued(await ensureDraft(), added);
      } catch {
        // each failed file shows its own reason
      }
    }
  }

  function applyLoadFigures(summary: LoadSummary) {
    const round = (x: number) => Number(x.toPrecision(3));
    setValue('spec.output.iMin', round(summary.iMinA), { shouldValidate: true, shouldDirty: true });
    setValue('spec.output.iTyp', round(summary.iTypA), { shouldValidate: true, shouldDirty: true });
    setValue('spec.output.iMax', round(summary.iMaxA), { shouldValidate: true, shouldDirty: true });
  }

  async function go(to: number) {
    if (to > step) {
      const fields = WIZARD_STEPS.slice(step, to).flatMap((s) => s.fields) as FieldPath<WizardInput>[];
      if (fields.length && !(await trigger(fields, { shouldFocus: true }))) return;
    }
    setStep(to);
    requestAnimationFrame(() => headingRef.current?.focus());
  }

  async function submit(justSignedIn = false) {
    setSubmitError(null);
    if (!(await trigger())) {
      const firstBad = WIZARD_STEPS.findIndex((s) => s.fields.some((f) => form.getFieldState(f as FieldPath<WizardInput>).invalid));
      if (firstBad >= 0) setStep(firstBad);
      return;
    }
    if (!signedIn && !justSignedIn) {
      setAskAccount(true);
      return;
    }
    setSubmitting(true);
    try {
      const id = await ensureDraft();
      await uploadQueued(id, files);
      const current = getValues();
      const response = await fetch(`/api/v1/briefs/${id}`, {
        method: 'PATCH',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ title: current.title.trim(), notes: current.notes, spec: current.spec, submit: true }),
      });
      const body = (await response.json().catch(() => ({}))) as { message?: string; issues?: { path: string; message: string }[] };
      if (!response.ok) {
        setSubmitError(body.issues?.[0]?.message ?? body.message ?? 'The brief could not be submitted.');
        return;
      }
      window.localStorage.removeItem(LOCAL_KEY);
      window.location.assign(`/briefs/${id}?submitted=1`);
    } catch (error) {
      setSubmitError((error as Error).message || 'The brief could not be submitted.');
    } finally {
      setSubmitting(false);
    }
  }

  const errors = formState.errors;
  const specErrors = errors.spec;
  const current = WIZARD_STEPS[step] ?? WIZARD_STEPS[0];
  const source = (values.spec?.input?.source ?? 'adapter') as SourceKind;

  const number = (
    name: FieldPath<WizardInput>,
    label: string,
    unit: string,
    error: string | undefined,
    hint?: string,
    percent = false,
    optional = false,
  ) => (
    <Controller
      control={control}
      name={name}
      rules={{ deps: relatedFields(name) }}
      render={({ field }) => (
        <SiNumberField
          id={`f-${name.replaceAll('.', '-')}`}
          label={label}
          unit={unit}
          value={field.value as number | undefined}
          onChange={field.onChange}
          onBlur={field.onBlur}
          error={error}
          hint={hint}
          percent={percent}
          optional={optional}
        />
      )}
    />
  );

  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,1.5fr)_minmax(0,1fr)]">
      <div>
        <nav aria-label="Steps">
          <ol className="flex flex-wrap gap-1.5 text-xs font-semibold">
            {WIZARD_STEPS.map((s, index) => (
              <li key={s.id}>
                <button
                  type="button"
                  onClick={() => void go(index)}
                  aria-current={index === step ? 'step' : undefined}
                  className={`rounded-full border px-3 py-1 ${index === step ? 'border-copper-700 bg-copper-700 text-white' : index < step ? 'border-copper-500/40 bg-copper-50 text-copper-700' : 'border-ink/20 bg-card text-ink-soft'}`}
                >
                  <span aria-hidden="true">{index < step ? '✓ ' : `${index + 1} `}</span>
                  {s.title}
                </button>
              </li>
            ))}
          </ol>
        </nav>

        <form
          className="mt-5 rounded-lg border border-rule bg-card p-5"
          noValidate
          onSubmit={(event) => {
            event.preventDefault();
            if (step === WIZARD_STEPS.length - 1) void submit();
            else void go(step + 1);
          }}
        >
          <h2 ref={headingRef} tabIndex={-1} className="text-xl font-bold outline-none">
            Step {step + 1} of {WIZARD_STEPS.length}: {current.title}
          </h2>

          {current.id === 'source' && (
            <div className="mt-4 grid gap-4 sm:grid-cols-2">
              <div className="sm:col-span-2">
                <FieldShell id="f-source" label="What feeds the rail?" hint={SOURCE_TYPICAL[source].hint}>
                  <select id="f-source" className={inputClass()} {...register('spec.input.source')}>
                    <option value="battery">A battery</option>
                    <option value="adapter">A DC adapter</option>
                    <option value="rectified">Rectified transformer output</option>
                    <option value="bus">A DC bus (e.g. 24 V industrial)</option>
                  </select>
                </FieldShell>
                <button
                  type="button"
                  className="mt-2 text-sm font-semibold text-copper-700 underline"
                  onClick={() => {
                    const typical = SOURCE_TYPICAL[source];
                    for (const key of ['vMin', 'vNom', 'vMax', 'rippleVpp'] as const)
                      setValue(`spec.input.${key}`, typical[key], { shouldValidate: true, shouldDirty: true });
                  }}
                >
                  Use typical figures for this source
                </button>
              </div>
              {number('spec.input.vMin', 'Lowest input voltage', 'V', specErrors?.input?.vMin?.message)}
              {number('spec.input.vNom', 'Nominal input voltage', 'V', specErrors?.input?.vNom?.message)}
              {number(
                'spec.input.vMax',
                'Highest input voltage',
                'V',
                specErrors?.input?.vMax?.message,
                'Include surges the regulator must survive.',
              )}
              {number(
                'spec.input.rippleVpp',
                'Ripple on the input',
                'V',
                specErrors?.input?.rippleVpp?.message,
                'Peak to peak; 0 for a battery.',
              )}
            </div>
          )}

          {current.id === 'rail' && (
            <div className="mt-4 grid gap-4 sm:grid-cols-2">
              <div className="sm:col-span-2">
                <FieldShell
                  id="f-title"
                  label="Name of the rail"
                  error={errors.title?.message}
                  hint="How you will recognise it, e.g. “Sensor board 3.3 V”."
                >
                  <input
                    id="f-title"
                    className={inputClass(errors.title?.message)}
                    {...register('title')}
                    aria-invalid={errors.title ? true : undefined}
                  />
                </FieldShell>
              </div>
              {number('spec.output.v', 'Output voltage', 'V', specErrors?.output?.v?.message)}
              {number(
                'spec.output.tolerance',
                'Allowed deviation (±)',
                '%',
                specErrors?.output?.tolerance?.message,
                'Digital logic usually allows ±5 %.',
                true,
              )}
            </div>
          )}

          {current.id === 'load' && (
            <div className="mt-4 grid gap-4 sm:grid-cols-3">
              {number('spec.output.iMin', 'Lowest load current', 'A', specErrors?.output?.iMin?.message, 'Asleep or idle.')}
              {number('spec.output.iTyp', 'Typical load current', 'A', specErrors?.output?.iTyp?.message, 'Most of the time.')}
              {number('spec.output.iMax', 'Highest load current', 'A', specErrors?.output?.iMax?.message, 'Worst burst.')}
              {number(
                'spec.output.loadStep',
                'Load step (optional)',
                'A',
                specErrors?.output?.loadStep?.message,
                'A sudden change in load current the rail must ride through.',
                false,
                true,
              )}
              {number(
                'spec.output.maxStepDeviation',
                'Allowed dip or overshoot during the step',
                'V',
                specErrors?.output?.maxStepDeviation?.message,
                'Leave empty if any deviation inside the tolerance will do.',
                false,
                true,
              )}
              <p className="text-sm text-ink-soft sm:col-span-3">
                Have a measured log? Attach it as a CSV of time and current in the files step; we work these figures out from it.
              </p>
            </div>
          )}

          {current.id === 'quietness' && (
            <div className="mt-4 grid gap-4 sm:grid-cols-2">
              <div className="sm:col-span-2">
                <FieldShell
                  id="f-noise"
                  label="What does the rail feed?"
                  hint={NOISE_CLASS_WORDS[(values.spec?.noise?.class ?? 'digital') as keyof typeof NOISE_CLASS_WORDS].hint}
                >
                  <select
                    id="f-noise"
                    className={inputClass()}
                    {...register('spec.noise.class', {
                      onChange: (event: React.ChangeEvent<HTMLSelectElement>) =>
                        setValue('spec.noise.maxRippleVpp', rippleDefault(event.target.value as (typeof noiseClasses)[number]), {
                          shouldValidate: true,
                        }),
                    })}
                  >
                    {noiseClasses.map((c) => (
                      <option key={c} value={c}>
                        {NOISE_CLASS_WORDS[c].label}
                      </option>
                    ))}
                  </select>
                </FieldShell>
              </div>
              {number(
                'spec.noise.maxRippleVpp',
                'Most ripple and noise it tolerates',
                'V',
                specErrors?.noise?.maxRippleVpp?.message,
                'Peak to peak. Set from the choice above; change it if you know better.',
              )}
            </div>
          )}

          {current.id === 'surroundings' && (
            <div className="mt-4 grid gap-4 sm:grid-cols-2">
              {number(
                'spec.thermal.ambientMaxC',
                'Hottest surrounding air',
                '°C',
                specErrors?.thermal?.ambientMaxC?.message,
                'Inside the enclosure, on the worst day.',
              )}
              <FieldShell id="f-airflow" label="Airflow">
                <select id="f-airflow" className={inputClass()} {...register('spec.thermal.airflow')}>
                  {Object.entries(AIRFLOW_WORDS).map(([value, label]) => (
                    <option key={value} value={value}>
                      {label}
                    </option>
                  ))}
                </select>
              </FieldShell>
            </div>
          )}

          {current.id === 'files' && (
            <div className="mt-4 flex flex-col gap-4">
              <FieldShell
                id="f-files"
                label="Schematics, datasheets, photos or a load log (CSV)"
                hint="Up to 10 MB each. PDF, PNG, JPEG, WebP, or CSV/text for a load log."
              >
                <input id="f-files" type="file" multiple className="text-sm" onChange={(event) => void addFiles(event.target.files)} />
              </FieldShell>
              {files.length > 0 && (
                <ul className="flex flex-col gap-2" aria-label="Files to attach">
                  {files.map((item) => (
                    <li key={item.key} className="rounded-md border border-rule p-3 text-sm">
                      <div className="flex flex-wrap items-center justify-between gap-2">
                        <span className="font-semibold">{item.file.name}</span>
                        <span className="text-ink-soft">
                          {item.state === 'done'
                            ? '✓ attached'
                            : item.state === 'failed'
                              ? '✕ refused'
                              : item.state === 'uploading'
                                ? `${Math.round(item.progress * 100)} %`
                                : signedIn
                                  ? 'waiting'
                                  : 'attached when you submit'}
                        </span>
                      </div>
                      {item.state === 'uploading' && (
                        <progress className="mt-1 w-full" max={1} value={item.progress} aria-label={`Uploading ${item.file.name}`} />
                      )}
                      {item.error && <p className="mt-1 text-stop-700">{item.error}</p>}
                      {item.loadError && <p className="mt-1 text-stop-700">This load log cannot be read: {item.loadError}</p>}
                      {item.loadSummary && (
                        <div className="mt-2">
                          <p className="tabular-nums">
                            {item.loadSummary.samples} samples over {formatSi(item.loadSummary.durationS, 's')}: min{' '}
                            {formatSi(item.loadSummary.iMinA, 'A')}, mean {formatSi(item.loadSummary.iTypA, 'A')}, RMS{' '}
                            {formatSi(item.loadSummary.iRmsA, 'A')}, peak {formatSi(item.loadSummary.iMaxA, 'A')}
                          </p>
                          <Suspense fallback={null}>
                            <LoadLogPlot summary={item.loadSummary} />
                          </Suspense>
                          <button
                            type="button"
                            className="mt-1 font-semibold text-copper-700 underline"
                            onClick={() => item.loadSummary && applyLoadFigures(item.loadSummary)}
                          >
                            Use these figures for the load
                          </button>
                        </div>
                      )}
                    </li>
                  ))}
                </ul>
              )}
              <FieldShell id="f-notes" label="Anything else we should know" error={errors.notes?.message}>
                <textarea id="f-notes" rows={5} className={inputClass(errors.notes?.message)} {...register('notes')} />
              </FieldShell>
            </div>
          )}

          {current.id === 'review' && (
            <div className="mt-4 flex flex-col gap-3 text-sm">
              <dl className="divide-y divide-rule rounded-md border border-rule">
                {[
                  ['Name', values.title || '—'],
                  [
                    'Input',
                    `${formatSi(Number(values.spec?.input?.vMin), 'V')} – ${formatSi(Number(values.spec?.input?.vMax), 'V')} (nominal ${formatSi(Number(values.spec?.input?.vNom), 'V')}), ${values.spec?.input?.source}`,
                  ],
                  [
                    'Output',
                    `${formatSi(Number(values.spec?.output?.v), 'V')} ±${(Number(values.spec?.output?.tolerance) * 100).toFixed(1)} %`,
                  ],
                  [
                    'Load',
                    `${formatSi(Number(values.spec?.output?.iMin), 'A')} / ${formatSi(Number(values.spec?.output?.iTyp), 'A')} / ${formatSi(Number(values.spec?.output?.iMax), 'A')}`,
                  ],
                  ...(values.spec?.output?.loadStep
                    ? [
                        [
                          'Load step',
                          `${formatSi(Number(values.spec.output.loadStep), 'A')}${values.spec.output.maxStepDeviation ? `, at most ${formatSi(Number(values.spec.output.maxStepDeviation), 'V')} deviation` : ''}`,
                        ],
                      ]
                    : []),
                  ['Ripple limit', formatSi(Number(values.spec?.noise?.maxRippleVpp), 'V')],
                  [
                    'Surroundings',
                    `${values.spec?.thermal?.ambientMaxC} °C, ${AIRFLOW_WORDS[(values.spec?.thermal?.airflow ?? 'still-air') as keyof typeof AIRFLOW_WORDS]}`,
                  ],
                  ['Notes', values.notes?.trim() || 'none'],
                  ['Files', files.length ? files.map((f) => f.file.name).join(', ') : 'none'],
                ].map(([term, value]) => (
                  <div key={term} className="grid grid-cols-[7rem_1fr] gap-2 px-3 py-2">
                    <dt className="font-semibold text-ink-soft">{term}</dt>
                    <dd className="tabular-nums">{value}</dd>
                  </div>
                ))}
              </dl>
              <p className="text-ink-soft">
                An engineer reviews every brief before anything is quoted. You can follow it on your briefs page.
              </p>
              {submitError && (
                <p role="alert" className="font-medium text-stop-700">
                  {submitError}
                </p>
              )}
            </div>
          )}

          <div className="mt-6 flex flex-wrap items-center gap-3">
            {step > 0 && (
              <button
                type="button"
                onClick={() => void go(step - 1)}
                className="rounded-md border border-ink/25 bg-card px-4 py-2 text-sm font-semibold hover:border-ink/60"
              >
                Back
              </button>
            )}
            <button
              type="submit"
              disabled={submitting}
              className="rounded-md border border-copper-700 bg-copper-700 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-600 disabled:opacity-50"
            >
              {step === WIZARD_STEPS.length - 1 ? (submitting ? 'Submitting…' : 'Submit the brief') : 'Next'}
            </button>
            <span className="text-xs text-ink-faint" aria-live="polite">
              {saveNote}
            </span>
          </div>
        </form>
        {current.id === 'review' && askAccount && !signedIn && (
          <div className="mt-4">
            <Suspense fallback={<p className="text-sm text-ink-soft">Loading the sign-up form…</p>}>
              <InlineAccount
                onSignedIn={() => {
                  setSignedIn(true);
                  setAskAccount(false);
                  void submit(true);
                }}
              />
            </Suspense>
          </div>
        )}
      </div>
      <aside className="lg:sticky lg:top-4 lg:self-start">
        <LiveRanking state={ranking} />
      </aside>
    </div>
  );
}
