import { useEffect, useRef, useState } from 'react';
import { railSpecSchema } from '~/lib/engine/rail-spec';
import type { Evaluation } from '~/lib/engine/types';
import type { Ranked, RankingState } from './LiveRanking';

const DEBOUNCE_MS = 350;

/** Re-ranks the brief shortly after the client stops typing; stale answers are dropped. */
export function useLiveRanking(spec: unknown): RankingState {
  const [state, setState] = useState<RankingState>({ kind: 'incomplete', message: 'Fill in the source and the rail to see the options.' });
  const last = useRef<Ranked | null>(null);
  const key = JSON.stringify(spec);

  useEffect(() => {
    const parsed = railSpecSchema.safeParse(spec);
    if (!parsed.success) {
      const first = parsed.error.issues[0];
      setState({ kind: 'incomplete', message: first ? `To rank the options: ${first.message}` : 'The brief is not complete yet.' });
      return;
    }
    const controller = new AbortController();
    const timer = setTimeout(async () => {
      setState({ kind: 'loading', previous: last.current });
      try {
        const response = await fetch('/api/v1/evaluate', {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify(parsed.data),
          signal: controller.signal,
        });
        if (response.status === 429) {
          setState({ kind: 'failed', message: 'Too many updates in a short time; the ranking will refresh in a moment.' });
          return;
        }
        if (!response.ok) {
          setState({ kind: 'failed', message: 'The ranking could not be computed for these figures.' });
          return;
        }
        const ranked = { result: (await response.json()) as Evaluation, spec: parsed.data };
        last.current = ranked;
        setState({ kind: 'ready', ranked });
      } catch (error) {
        if ((error as Error).name !== 'AbortError')
          setState({ kind: 'failed', message: 'The ranking is not reachable right now; your brief is not affected.' });
      }
    }, DEBOUNCE_MS);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
    // The serialised spec is the dependency: a new object with the same values must not re-rank.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);

  return state;
}
