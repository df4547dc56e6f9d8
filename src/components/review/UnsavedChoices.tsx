import type { KeptChoices } from './kept-choices';

/** Says that the adjust form holds settings no revision has saved yet, and offers to drop them. */
export function UnsavedChoices({ kept }: { kept: KeptChoices }) {
  if (!kept.unsaved) return null;
  const from = kept.savedFrom === null ? 'the brief as submitted' : `revision ${kept.savedFrom}`;
  const lead = kept.restored ? 'Unsaved settings from your last visit.' : 'Unsaved settings.';
  return (
    <div
      role="status"
      className="flex flex-col gap-3 rounded-lg border border-warn-700/30 bg-warn-50 px-4 py-3 text-sm sm:flex-row sm:items-center"
    >
      <p className="min-w-0 flex-1">
        <strong>{lead}</strong>{' '}
        {`The adjust form differs from ${from}; this browser keeps these settings until you save a revision or discard them.`}
      </p>
      <button
        type="button"
        onClick={kept.discard}
        className="shrink-0 self-start rounded-md border border-ink/25 bg-card px-3 py-1.5 text-sm font-semibold hover:border-ink/60 sm:self-auto"
      >
        Discard unsaved settings
      </button>
    </div>
  );
}
