import type { RailSpec } from '~/lib/engine/rail-spec';
import { scoreShares, stepWord, WEIGHT_STEPS } from '~/lib/ranking/weight-scale';
import { percent } from '~/lib/review/option-words';
import { WEIGHT_KEYS, WEIGHT_NAMES, type WeightKey } from '~/lib/review/words';

interface Props {
  weights: Record<WeightKey, string>;
  onChange: (weights: Record<WeightKey, string>) => void;
  errorAt: (path: string) => string | undefined;
  /** The rail the shares are worked out for: on a small rail part count and cost weigh more. */
  rail: Pick<RailSpec, 'input' | 'output'>;
}

/** How much each quality counts in the score, set in named steps, with the share each step gives it. */
export function WeightsControl({ weights, onChange, errorAt, rail }: Props) {
  const numbers = Object.fromEntries(WEIGHT_KEYS.map((k) => [k, Number(weights[k])])) as Record<WeightKey, number>;
  const valid = WEIGHT_KEYS.every((k) => weights[k].trim() !== '' && Number.isFinite(numbers[k]) && numbers[k] >= 0);
  const shares = valid ? scoreShares(numbers, rail) : null;
  return (
    <fieldset className="mt-3" aria-describedby="weights-scale">
      <legend className="text-base font-bold">What matters most for this rail</legend>
      <p id="weights-scale" className="mt-1 text-sm text-ink-soft">
        Each quality counts in proportion to the others: {WEIGHT_STEPS.map((s) => `${s.word.toLowerCase()} = ${s.value}`).join(', ')} on the
        engine’s scale. The share beside each is what it counts for in the score of this rail.
      </p>
      <div className="mt-3 flex flex-col gap-2">
        {WEIGHT_KEYS.map((key) => {
          const saved = numbers[key];
          const custom = Number.isFinite(saved) && stepWord(saved) === null ? saved : null;
          const error = errorAt(`weights.${key}`);
          const share = shares?.[key];
          return (
            <div
              key={key}
              role="radiogroup"
              aria-labelledby={`weight-${key}-name`}
              className="flex flex-wrap items-center gap-x-3 gap-y-1"
              data-weight={key}
            >
              <span id={`weight-${key}-name`} className="w-28 text-sm font-semibold">
                {WEIGHT_NAMES[key]}
              </span>
              <span className="inline-flex flex-wrap overflow-hidden rounded-md border border-ink/25">
                {[...WEIGHT_STEPS, ...(custom === null ? [] : [{ value: custom, word: `As saved (${custom})` }])].map((step) => (
                  <label
                    key={step.value}
                    className="relative cursor-pointer border-r border-ink/15 px-2.5 py-1 text-sm last:border-r-0 has-[:checked]:bg-copper-700 has-[:checked]:font-semibold has-[:checked]:text-white has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-copper-500"
                  >
                    <input
                      type="radio"
                      className="sr-only"
                      name={`weight-${key}`}
                      value={step.value}
                      checked={saved === step.value && weights[key].trim() !== ''}
                      onChange={() => onChange({ ...weights, [key]: String(step.value) })}
                    />
                    {step.word}
                  </label>
                ))}
              </span>
              <span className="text-xs text-ink-faint tabular-nums" data-share>
                {share === undefined ? '' : `${percent(share)} of the score`}
              </span>
              {error && (
                <span className="w-full text-sm font-medium text-stop-700">
                  <span aria-hidden="true">✕ </span>
                  {error}
                </span>
              )}
            </div>
          );
        })}
      </div>
      {shares === null && valid && (
        <p className="mt-2 text-sm font-medium text-stop-700" role="alert">
          <span aria-hidden="true">✕ </span>Let at least one quality count: with every one ignored nothing can be ranked.
        </p>
      )}
    </fieldset>
  );
}
