import { useMemo, useState } from 'react';
import { formatMoney } from '~/lib/platform/format';
import {
  formatBp,
  formatDecimal,
  lineTotal,
  minorDigits,
  parseDecimal,
  QUOTE_LINE_KINDS,
  quoteTotals,
  type QuoteLineInput,
} from '~/lib/quotes/pricing';
import type { QuoteJson } from '~/lib/quotes/quotes.server';
import { describedBy, FieldShell, inputClass } from '../ui/FieldShell';

interface Props {
  initial: QuoteJson;
  /** The last failed attempt to e-mail this quote, if the latest attempt failed. */
}

interface LineDraft {
  key: number;
  kind: QuoteLineInput['kind'];
  description: string;
  quantity: string;
  unit: string;
  unitPrice: string;
}

const KIND_WORDS: Record<QuoteLineInput['kind'], string> = {
  design: 'Design work',
  'hv-review': 'HV safety review',
  parts: 'Parts',
  prototype: 'Prototype build',
  'test-report': 'Test and report',
  other: 'Other',
};

let nextKey = 0;

function draftsOf(quote: QuoteJson, digits: number): LineDraft[] {
  return quote.lines.map((l) => ({
    key: nextKey++,
    kind: l.kind,
    description: l.description,
    quantity: formatDecimal(l.quantityMilli, 3).replace(/\.?0+$/, ''),
    unit: l.unit,
    unitPrice: formatDecimal(l.unitPriceMinor, digits),
  }));
}

const isoDay = (iso: string) => iso.slice(0, 10);
type TextField = 'description' | 'quantity' | 'unit' | 'unitPrice';
/** Where the server reports a problem with each box (its field in the request). */
const ERROR_KEYS: Record<TextField, string> = {
  description: 'description',
  quantity: 'quantityMilli',
  unit: 'unit',
  unitPrice: 'unitPriceMinor',
};
/** One line's columns on a wide screen; on narrower ones a line stacks its labelled boxes two to a row. */
const LINE_GRID = 'lg:gap-x-2 lg:grid-cols-[9rem_minmax(9rem,1fr)_4rem_4.5rem_6.5rem_6rem_2rem]';
const percentText = (bp: number) => formatDecimal(bp, 2).replace(/\.00$/, '');

/** The engineer's editor for a draft quote: lines, units, rates, validity, terms, the note to the client; save, preview, send. */
export function QuoteEditor({ initial }: Props) {
  const digits = minorDigits(initial.currency);
  const [saved, setSaved] = useState(initial);
  const [lines, setLines] = useState(() => draftsOf(initial, digits));
  const [quantity, setQuantity] = useState(String(initial.quantity));
  const [tax, setTax] = useState(percentText(initial.taxRateBp));
  const [deposit, setDeposit] = useState(percentText(initial.depositBp));
  const [validUntil, setValidUntil] = useState(isoDay(initial.validUntil));
  const [terms, setTerms] = useState(initial.terms);
  const [clientNote, setClientNote] = useState(initial.clientNote);
  const [dirty, setDirty] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ tone: 'ok' | 'stop'; text: string } | null>(null);
  const [busy, setBusy] = useState<'save' | 'send' | null>(null);
  // Sending cannot be undone (the client gets the e-mail), so it takes a second, confirming click.
  const [confirmingSend, setConfirmingSend] = useState(false);

  const edit =
    <T,>(setter: (v: T) => void) =>
    (value: T) => {
      setter(value);
      setDirty(true);
    };
  const setLine = (key: number, patch: Partial<LineDraft>) => {
    setLines((all) => all.map((l) => (l.key === key ? { ...l, ...patch } : l)));
    setDirty(true);
  };

  /** The form as the API takes it, or the fields that do not read as numbers. */
  const read = useMemo(() => {
    const issues: Record<string, string> = {};
    const parsed = lines.map((l, i) => {
      const quantityMilli = parseDecimal(l.quantity, 3);
      const unitPriceMinor = parseDecimal(l.unitPrice, digits);
      if (quantityMilli === null) issues[`lines.${i}.quantityMilli`] = 'A number, up to 3 decimals.';
      if (unitPriceMinor === null) issues[`lines.${i}.unitPriceMinor`] = `An amount, up to ${digits} decimals.`;
      return {
        kind: l.kind,
        description: l.description,
        unit: l.unit,
        quantityMilli: quantityMilli ?? 0,
        unitPriceMinor: unitPriceMinor ?? 0,
      };
    });
    const units = parseDecimal(quantity, 0);
    const taxRateBp = parseDecimal(tax, 2);
    const depositBp = parseDecimal(deposit, 2);
    if (units === null) issues.quantity = 'A whole number of units.';
    if (taxRateBp === null) issues.taxRateBp = 'A percentage, up to 2 decimals.';
    if (depositBp === null) issues.depositBp = 'A percentage, up to 2 decimals.';
    return {
      issues,
      body: { lines: parsed, quantity: units ?? 0, taxRateBp: taxRateBp ?? 0, depositBp: depositBp ?? 0, validUntil, terms, clientNote },
    };
  }, [lines, quantity, tax, deposit, validUntil, terms, clientNote, digits]);

  // A preview with the server's own arithmetic; what is stored comes back from the save.
  const preview = quoteTotals(read.body.lines, read.body.taxRateBp, read.body.depositBp);
  const money = (minor: number) => formatMoney(minor, saved.currency);

  async function save(): Promise<boolean> {
    setStatus(null);
    if (Object.keys(read.issues).length) {
      setErrors(read.issues);
      setStatus({ tone: 'stop', text: 'Some fields need correcting before the quote can be saved.' });
      return false;
    }
    setBusy('save');
    try {
      const response = await fetch(`/api/v1/quotes/${saved.id}`, {
        method: 'PATCH',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(read.body),
      });
      const body = (await response.json().catch(() => ({}))) as QuoteJson & {
        message?: string;
        issues?: { path: string; message: string }[];
      };
      if (!response.ok) {
        setErrors(Object.fromEntries((body.issues ?? []).map((i) => [i.path, i.message])));
        setStatus({
          tone: 'stop',
          text: body.issues?.length
            ? 'Some fields need correcting before the quote can be saved.'
            : (body.message ?? `Saving failed (${response.status}); try again.`),
        });
        return false;
      }
      setErrors({});
      setSaved(body);
      setLines(draftsOf(body, digits));
      setDirty(false);
      setStatus({ tone: 'ok', text: 'Saved. The totals below are the stored ones.' });
      return true;
    } catch {
      setStatus({ tone: 'stop', text: 'The server could not be reached; your changes are still here. Try again.' });
      return false;
    } finally {
      setBusy(null);
    }
  }

  async function send() {
    setConfirmingSend(false);
    if (dirty && !(await save())) return;
    setBusy('send');
    setStatus(null);
    try {
      const response = await fetch(`/api/v1/quotes/${saved.id}/send`, { method: 'POST' });
      const body = (await response.json().catch(() => ({}))) as { message?: string };
      if (!response.ok) {
        setStatus({ tone: 'stop', text: body.message ?? `Sending failed (${response.status}); try again.` });
        return;
      }
      window.location.assign(`/desk/quotes/${saved.id}?sent=1`);
    } catch {
      setStatus({ tone: 'stop', text: 'The server could not be reached; nothing was sent. Try again.' });
    } finally {
      setBusy(null);
    }
  }

  const cell = (i: number, name: string) => errors[`lines.${i}.${name}`];
  const small = (error?: string) => `${inputClass(error)} !px-2 !py-1 text-sm`;

  return (
    <div className="flex flex-col gap-6">
      {status && (
        <div
          role={status.tone === 'stop' ? 'alert' : 'status'}
          className={`rounded-md border px-4 py-3 text-sm font-medium ${status.tone === 'ok' ? 'border-ok-700/30 bg-ok-50 text-ok-700' : 'border-stop-700/30 bg-stop-50 text-stop-700'}`}
        >
          {status.text}
        </div>
      )}
      <div>
        <div
          aria-hidden="true"
          className={`hidden gap-x-3 border-b-2 border-ink px-3 pb-2 text-sm font-bold text-ink-soft lg:grid ${LINE_GRID}`}
        >
          <span>Kind</span>
          <span>Description</span>
          <span className="text-right">Qty</span>
          <span>Unit</span>
          <span className="text-right">Unit price ({saved.currency})</span>
          <span className="text-right">Amount</span>
          <span />
        </div>
        <ol
          aria-label={`Lines of quote ${saved.number}`}
          className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-card lg:rounded-t-none lg:border-t-0"
        >
          {lines.map((l, i) => {
            const row = read.body.lines[i];
            const id = (what: string) => `line-${l.key}-${what}`;
            // Each box is labelled on a phone, where lines stack; on a wide screen the header row names the columns.
            const label = (what: string, name: string, shown = '') => (
              <label htmlFor={id(name)} className="text-xs font-semibold text-ink-soft lg:sr-only">
                {what}
                {shown}
              </label>
            );
            // The box's own name carries its line, so a screen reader and a test can tell the lines apart.
            const named = (what: string) => `${what}, line ${i + 1}`;
            const box = (field: TextField, what: string, look: { numeric?: boolean; wide?: boolean; shown?: string }) => {
              const error = cell(i, ERROR_KEYS[field]);
              return (
                <div className={`flex flex-col gap-1 ${look.wide ? 'col-span-2 lg:col-span-1' : ''}`}>
                  {label(what, field, look.shown)}
                  <input
                    id={id(field)}
                    aria-label={named(what)}
                    inputMode={look.numeric ? 'decimal' : undefined}
                    aria-invalid={error ? true : undefined}
                    className={`${small(error)} ${look.numeric ? 'text-right tabular-nums' : ''}`}
                    value={l[field]}
                    onChange={(e) => setLine(l.key, { [field]: e.target.value })}
                  />
                  {error && <p className="text-xs text-stop-700">{error}</p>}
                </div>
              );
            };
            return (
              <li key={l.key} className={`grid grid-cols-2 gap-x-3 gap-y-2 p-3 lg:items-start ${LINE_GRID}`}>
                <div className="col-span-2 flex flex-col gap-1 lg:col-span-1">
                  {label('Kind', 'kind')}
                  <select
                    id={id('kind')}
                    aria-label={named('Kind')}
                    className={small()}
                    value={l.kind}
                    onChange={(e) => setLine(l.key, { kind: e.target.value as LineDraft['kind'] })}
                  >
                    {QUOTE_LINE_KINDS.map((k) => (
                      <option key={k} value={k}>
                        {KIND_WORDS[k]}
                      </option>
                    ))}
                  </select>
                </div>
                {box('description', 'Description', { wide: true })}
                {box('quantity', 'Quantity', { numeric: true })}
                {box('unit', 'Unit', {})}
                {box('unitPrice', 'Unit price', { numeric: true, shown: ` (${saved.currency})` })}
                <p className="flex flex-col gap-1 text-right text-sm tabular-nums lg:py-1">
                  <span className="text-xs font-semibold text-ink-soft lg:sr-only">Amount</span>
                  <span className="whitespace-nowrap">{row ? money(lineTotal(row)) : '—'}</span>
                </p>
                <button
                  type="button"
                  className="col-span-2 justify-self-end rounded px-2 py-1 text-sm font-semibold text-stop-700 hover:bg-stop-50 disabled:opacity-40 lg:col-span-1"
                  disabled={lines.length === 1}
                  title={`Remove line ${i + 1}`}
                  onClick={() => {
                    setLines((all) => all.filter((x) => x.key !== l.key));
                    setDirty(true);
                  }}
                >
                  <span className="lg:sr-only">Remove</span>
                  <span aria-hidden="true" className="hidden lg:inline">
                    ✕
                  </span>
                  <span className="sr-only"> line {i + 1}</span>
                </button>
              </li>
            );
          })}
        </ol>
      </div>
      {errors.lines && <p className="text-sm text-stop-700">{errors.lines}</p>}
      <p>
        <button
          type="button"
          className="rounded-md border border-ink/25 bg-card px-3 py-1.5 text-sm font-semibold hover:border-ink/60"
          onClick={() => {
            setLines((all) => [
              ...all,
              { key: nextKey++, kind: 'other', description: '', quantity: '1', unit: 'item', unitPrice: formatDecimal(0, digits) },
            ]);
            setDirty(true);
          }}
        >
          Add a line
        </button>
      </p>

      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        {(
          [
            [
              'quantity',
              'Units',
              quantity,
              edit(setQuantity),
              'units',
              'Parts and prototype lines follow this number when you change it alone.',
            ],
            ['taxRateBp', 'Tax rate', tax, edit(setTax), '%', undefined],
            ['depositBp', 'Deposit on acceptance', deposit, edit(setDeposit), '% of total', undefined],
          ] as const
        ).map(([name, label, value, set, unit, hint]) => (
          <FieldShell key={name} id={`quote-${name}`} label={label} unit={unit} hint={hint} error={errors[name]}>
            <input
              id={`quote-${name}`}
              inputMode="decimal"
              aria-describedby={describedBy(`quote-${name}`, hint, errors[name])}
              aria-invalid={errors[name] ? true : undefined}
              className={inputClass(errors[name])}
              value={value}
              onChange={(e) => set(e.target.value)}
            />
          </FieldShell>
        ))}
        <FieldShell id="quote-validUntil" label="Valid until" error={errors.validUntil}>
          <input
            id="quote-validUntil"
            type="date"
            aria-describedby={describedBy('quote-validUntil', undefined, errors.validUntil)}
            aria-invalid={errors.validUntil ? true : undefined}
            className={inputClass(errors.validUntil)}
            value={validUntil}
            onChange={(e) => edit(setValidUntil)(e.target.value)}
          />
        </FieldShell>
      </div>
      <FieldShell id="quote-terms" label="Terms (one per line)" error={errors.terms}>
        <textarea
          id="quote-terms"
          rows={5}
          className={inputClass(errors.terms)}
          value={terms}
          onChange={(e) => edit(setTerms)(e.target.value)}
        />
      </FieldShell>
      <FieldShell
        id="quote-clientNote"
        label="Note to the client"
        error={errors.clientNote}
        hint="Printed on the quote page, the PDF and the e-mail. The revision's note stays internal and never reaches the client."
      >
        <textarea
          id="quote-clientNote"
          rows={3}
          maxLength={2000}
          aria-describedby={describedBy('quote-clientNote', 'hint', errors.clientNote)}
          aria-invalid={errors.clientNote ? true : undefined}
          className={inputClass(errors.clientNote)}
          value={clientNote}
          onChange={(e) => edit(setClientNote)(e.target.value)}
        />
      </FieldShell>

      <dl
        className="ml-auto grid w-full max-w-sm grid-cols-[1fr_auto] gap-x-6 gap-y-1 rounded-lg border border-rule bg-card p-4 text-sm tabular-nums"
        aria-label={dirty ? 'Totals of the unsaved changes' : 'Stored totals'}
      >
        <dt className="text-ink-soft">Subtotal</dt>
        <dd className="text-right">{money(dirty ? preview.subtotalMinor : saved.subtotalMinor)}</dd>
        <dt className="text-ink-soft">Tax ({formatBp(dirty ? read.body.taxRateBp : saved.taxRateBp)})</dt>
        <dd className="text-right">{money(dirty ? preview.taxMinor : saved.taxMinor)}</dd>
        <dt className="font-bold">Total</dt>
        <dd className="text-right font-extrabold">{money(dirty ? preview.totalMinor : saved.totalMinor)}</dd>
        <dt className="font-bold">Deposit ({formatBp(dirty ? read.body.depositBp : saved.depositBp)})</dt>
        <dd className="text-right font-bold">{money(dirty ? preview.depositMinor : saved.depositMinor)}</dd>
        {dirty && <dd className="col-span-2 mt-1 text-xs text-warn-700">Unsaved changes: these totals are a preview until you save.</dd>}
      </dl>

      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          onClick={() => void save()}
          disabled={busy !== null}
          className="rounded-md border border-ink/25 bg-card px-4 py-2 text-sm font-semibold hover:border-ink/60 disabled:opacity-50"
        >
          {busy === 'save' ? 'Saving…' : 'Save draft'}
        </button>
        <a
          href={`/api/v1/quotes/${saved.id}/pdf`}
          target="_blank"
          rel="noopener"
          className={`rounded-md px-4 py-2 text-sm font-semibold ${dirty ? 'pointer-events-none text-ink-faint' : ''}`}
          aria-disabled={dirty || undefined}
        >
          Preview the PDF{dirty ? ' (save first)' : ''}
        </a>
        {!confirmingSend && (
          <button
            type="button"
            onClick={() => setConfirmingSend(true)}
            disabled={busy !== null}
            className="ml-auto rounded-md border border-copper-700 bg-copper-700 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-600 disabled:opacity-50"
          >
            {busy === 'send' ? 'Sending…' : `Send to ${saved.client.email}…`}
          </button>
        )}
      </div>
      {confirmingSend && (
        <div role="group" aria-labelledby="confirm-send-heading" className="rounded-lg border-2 border-copper-500 bg-copper-50 p-4">
          <p id="confirm-send-heading" className="font-bold">
            Send quote {saved.number} to {saved.client.email}?
          </p>
          <p className="mt-1 text-sm">
            The client receives the PDF by e-mail{dirty ? ' (your changes are saved first)' : ''}; the quote can no longer be edited, and
            any earlier quote still open for this brief is withdrawn.
          </p>
          <div className="mt-3 flex flex-wrap gap-3">
            <button
              type="button"
              onClick={() => void send()}
              className="rounded-md border border-copper-700 bg-copper-700 px-4 py-2 text-sm font-semibold text-white hover:bg-copper-600"
            >
              Send quote {saved.number}
            </button>
            <button
              type="button"
              onClick={() => setConfirmingSend(false)}
              className="rounded-md border border-ink/25 bg-card px-4 py-2 text-sm font-semibold hover:border-ink/60"
            >
              Not yet
            </button>
          </div>
        </div>
      )}
    </div>
  );
}
