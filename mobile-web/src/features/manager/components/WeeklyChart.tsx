import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

export interface WeeklySeries {
  label: string;
  values: number[];
  stroke: string;
  dash?: number[];
}

/**
 * A line chart of weekly counts (uPlot, loaded with the trends screen only). Hidden from screen
 * readers: the same numbers are in the table beside it.
 */
export default function WeeklyChart({ weekStarts, series, title }: { weekStarts: number[]; series: WeeklySeries[]; title: string }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const width = Math.max(280, Math.min(el.clientWidth, 900));
    const plot = new uPlot(
      {
        title,
        width,
        height: 220,
        series: [{}, ...series.map((s) => ({ label: s.label, stroke: s.stroke, dash: s.dash, width: 2 }))],
        axes: [{ values: (_u: uPlot, ticks: number[]) => ticks.map((t) => new Date(t * 1000).toLocaleDateString(undefined, { day: 'numeric', month: 'short' })) }, {}],
        scales: { x: { time: true } },
      },
      [weekStarts.map((t) => t / 1000), ...series.map((s) => s.values)],
      el,
    );
    return () => plot.destroy();
  }, [weekStarts, series, title]);
  return <div ref={box} aria-hidden="true" style={{ width: '100%' }} />;
}
