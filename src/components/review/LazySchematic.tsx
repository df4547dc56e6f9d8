import { lazy, Suspense, useEffect, useRef, useState, type ComponentProps } from 'react';

// The drawing code (symbols, layouts, the SVG writer) is a tenth of the review's script: it loads
// when the drawing comes near the screen, not with the page.
const SchematicPanel = lazy(() => import('./SchematicPanel').then((m) => ({ default: m.SchematicPanel })));

/** How far below the screen the drawing starts loading, so it is drawn by the time it is reached. */
const AHEAD = '600px';

export function LazySchematic(props: ComponentProps<typeof SchematicPanel>) {
  const box = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const el = box.current;
    if (!el || near) return;
    const seen = new IntersectionObserver((entries) => entries.some((e) => e.isIntersecting) && setNear(true), { rootMargin: AHEAD });
    seen.observe(el);
    return () => seen.disconnect();
  }, [near]);
  const waiting = <p className="text-sm text-ink-soft">Drawing the circuit…</p>;
  return (
    <div ref={box} className="min-h-40">
      {near ? <Suspense fallback={waiting}>{<SchematicPanel {...props} />}</Suspense> : waiting}
    </div>
  );
}
