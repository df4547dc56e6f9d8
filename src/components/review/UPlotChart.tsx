import { useEffect, useRef, useState } from 'react';
import type uPlot from 'uplot';
// The stylesheet is small and goes with the page's CSS; only the library's script waits for a chart.
import 'uplot/dist/uPlot.min.css';

export type ChartBuilder = (lib: typeof uPlot, width: number) => { options: uPlot.Options; data: uPlot.AlignedData };

interface Props {
  build: ChartBuilder;
  /** What the chart shows, for people who cannot see it; the figures are also given as text beside it. */
  label: string;
}

/** A uPlot chart that loads the library only when a chart is first drawn, and follows its box's width. */
export function UPlotChart({ build, label }: Props) {
  const box = useRef<HTMLDivElement>(null);
  const [failed, setFailed] = useState(false);

  useEffect(() => {
    let chart: uPlot | null = null;
    let observer: ResizeObserver | null = null;
    let cancelled = false;
    import('uplot')
      .then((module) => {
        const el = box.current;
        if (cancelled || !el) return;
        const lib = module.default;
        const { options, data } = build(lib, el.clientWidth);
        chart = new lib(options, data, el);
        observer = new ResizeObserver(() => chart?.setSize({ width: el.clientWidth, height: options.height }));
        observer.observe(el);
      })
      .catch(() => setFailed(true));
    return () => {
      cancelled = true;
      observer?.disconnect();
      chart?.destroy();
    };
  }, [build]);

  return (
    <div ref={box} role="img" aria-label={label} className="rw-chart min-h-8 w-full">
      {failed && <p className="text-sm text-stop-700">The chart could not be drawn; the figures are listed below it.</p>}
    </div>
  );
}
