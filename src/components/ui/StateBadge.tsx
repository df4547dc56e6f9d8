import { lookOf, TONE_CLASSES, type StateLook } from '~/components/ui/state-look';

export function StateBadge({ table, state }: { table: Record<string, StateLook>; state: string }) {
  const look = lookOf(table, state);
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2.5 py-0.5 text-xs font-semibold ${TONE_CLASSES[look.tone]}`}
    >
      <span aria-hidden="true">{look.glyph}</span>
      {look.label}
    </span>
  );
}
