import type { Caution } from '~/lib/engine/types';
import { CAUTION_DEFERRAL } from '~/lib/review/words';

/** Safety cautions, shown wherever a design is shown; repeated wording across options appears once. */
export function CautionPanel({ cautions, heading = 'Cautions' }: { cautions: readonly Caution[]; heading?: string }) {
  const unique = [...new Map(cautions.map((c) => [c.message, c])).values()];
  const hazardous = unique.some((c) => c.code === 'hazardous-voltage');
  return (
    <section
      role="note"
      aria-label={heading}
      className={`rounded-lg border-2 p-4 ${hazardous ? 'border-stop-700 bg-stop-50' : 'border-warn-700/40 bg-warn-50'}`}
    >
      <h2 className={`text-lg font-extrabold ${hazardous ? 'text-stop-700' : 'text-warn-700'}`}>
        <span aria-hidden="true">{hazardous ? '⚡ ' : '! '}</span>
        {hazardous ? `${heading}: hazardous voltage` : heading}
      </h2>
      {unique.length > 0 ? (
        <ul className="mt-2 flex list-disc flex-col gap-1.5 pl-5 text-sm text-ink">
          {unique.map((c) => (
            <li key={c.message} data-caution={c.code}>
              {c.message}
            </li>
          ))}
        </ul>
      ) : (
        <p className="mt-2 text-sm text-ink">The engine raised no particular hazard for this design.</p>
      )}
      <p className="mt-3 text-sm font-semibold text-ink">{CAUTION_DEFERRAL}</p>
    </section>
  );
}
