/**
 * The adjust form's unsaved settings, kept in this browser per brief until a revision saves
 * them or the engineer discards them, so a reload or a closed tab loses nothing.
 */
import { useEffect, useState } from 'react';
import type { ChoicesForm } from '~/lib/review/choices';

const keyOf = (briefId: string) => `railwright:review-choices:${briefId}`;
const same = (a: ChoicesForm, b: ChoicesForm) => JSON.stringify(a) === JSON.stringify(b);

function strings<T extends Record<string, string>>(stored: unknown, fallback: T): T {
  const out = { ...fallback };
  if (stored && typeof stored === 'object')
    for (const key of Object.keys(fallback) as (keyof T)[]) {
      const value = (stored as Record<keyof T, unknown>)[key];
      if (typeof value === 'string') out[key] = value as T[keyof T];
    }
  return out;
}

/** What was stored, read onto the current form's shape: a field a later version added keeps its saved value. */
function readKept(text: string | null, saved: ChoicesForm): ChoicesForm | null {
  if (!text) return null;
  try {
    const stored = JSON.parse(text) as Partial<Record<keyof ChoicesForm, unknown>>;
    const parts = Array.isArray(stored.parts) ? stored.parts.map((p: unknown) => strings(p, { ref: '', value: '' })) : saved.parts;
    return {
      weights: strings(stored.weights, saved.weights),
      numbers: strings(stored.numbers, saved.numbers),
      picks: strings(stored.picks, saved.picks),
      requirement: strings(stored.requirement, saved.requirement),
      parts,
    };
  } catch {
    return null;
  }
}

/** Storage may be refused (private windows, full quota): the form then works as before, unkept. */
function storage(): Storage | null {
  try {
    return window.localStorage;
  } catch {
    return null;
  }
}

export interface KeptChoices {
  /** The form differs from the saved choices it started from. */
  unsaved: boolean;
  /** The unsaved settings came back from an earlier visit. */
  restored: boolean;
  /** The revision whose choices the form is compared with (null: the brief as submitted). */
  savedFrom: number | null;
  discard: () => void;
  /** Revision `number` now holds `form`: it becomes the saved choices. */
  saved: (form: ChoicesForm, number: number) => void;
}

export function useKeptChoices(
  briefId: string,
  start: { form: ChoicesForm; revision: number | null },
  form: ChoicesForm,
  setForm: (form: ChoicesForm) => void,
): KeptChoices {
  const [baseline, setBaseline] = useState(start.form);
  const [savedFrom, setSavedFrom] = useState(start.revision);
  const [ready, setReady] = useState(false);
  const [restored, setRestored] = useState(false);

  useEffect(() => {
    const kept = readKept(storage()?.getItem(keyOf(briefId)) ?? null, start.form);
    if (kept && !same(kept, start.form)) {
      setForm(kept);
      setRestored(true);
    }
    setReady(true);
    // Read when the island wakes (its props do not change after): later changes are written, not read.
  }, [briefId, start.form, setForm]);

  useEffect(() => {
    if (!ready) return;
    try {
      if (same(form, baseline)) storage()?.removeItem(keyOf(briefId));
      else storage()?.setItem(keyOf(briefId), JSON.stringify(form));
    } catch {
      // A full quota keeps the settings on screen only.
    }
  }, [briefId, form, baseline, ready]);

  return {
    unsaved: !same(form, baseline),
    restored: restored && !same(form, baseline),
    savedFrom,
    discard: () => {
      setForm(baseline);
      setRestored(false);
    },
    saved: (next, number) => {
      setBaseline(next);
      setSavedFrom(number);
      setRestored(false);
    },
  };
}
