import { feasibilityWords } from '~/lib/review/option-words';

/** Whether a revision's design meets the brief: a mark and the word, in the tone that goes with them. */
export function FeasibilityMark({ feasible }: { feasible: boolean }) {
  const { mark, text } = feasibilityWords(feasible);
  return (
    <span className={`whitespace-nowrap font-semibold ${feasible ? 'text-ok-700' : 'text-stop-700'}`}>
      <span aria-hidden="true">{mark} </span>
      {text}
    </span>
  );
}
