// A line chart drawn by chart.js once it has loaded; the figures table beside it carries the same data for print and screen readers.
import { useEffect, useState, type ComponentType, type ReactElement } from 'react';
import type { ChartData, ChartOptions } from 'chart.js';

export interface ChartPoint {
  x: number;
  y: number;
}

export interface LineChartProps {
  /** Read by screen readers in place of the picture; the table gives the figures. */
  label: string;
  points: readonly ChartPoint[];
  xTitle: string;
  yTitle: string;
  seriesLabel: string;
  logY?: boolean;
  /** One point to mark (the safe voltage reached, the part's own temperature). */
  marker?: (ChartPoint & { label: string }) | undefined;
  /** A horizontal line (the safe voltage). */
  level?: { y: number; label: string } | undefined;
}

type LineComponent = ComponentType<{ data: ChartData<'line'>; options: ChartOptions<'line'>; 'aria-label': string; role: string }>;

const TEAL = '#0f4c4a';
const AMBER = '#c7861a';
const BRICK = '#9a2f1f';

function chartData({ points, seriesLabel, marker, level }: LineChartProps): ChartData<'line'> {
  const datasets: ChartData<'line'>['datasets'] = [
    {
      label: seriesLabel,
      data: points.map((p) => ({ x: p.x, y: p.y })),
      borderColor: TEAL,
      backgroundColor: TEAL,
      pointRadius: 0,
      borderWidth: 2,
    },
  ];
  if (level && points.length > 0) {
    const xs = points.map((p) => p.x);
    datasets.push({
      label: level.label,
      data: [
        { x: Math.min(...xs), y: level.y },
        { x: Math.max(...xs), y: level.y },
      ],
      borderColor: AMBER,
      borderDash: [6, 4],
      pointRadius: 0,
      borderWidth: 2,
    });
  }
  if (marker) {
    datasets.push({
      label: marker.label,
      data: [{ x: marker.x, y: marker.y }],
      borderColor: BRICK,
      backgroundColor: BRICK,
      pointRadius: 5,
      showLine: false,
    });
  }
  return { datasets };
}

function chartOptions({ xTitle, yTitle, logY, points }: LineChartProps): ChartOptions<'line'> {
  const xs = points.map((p) => p.x);
  const xBounds = xs.length > 1 ? { min: Math.min(...xs), max: Math.max(...xs) } : {};
  return {
    animation: false,
    responsive: true,
    maintainAspectRatio: false,
    parsing: false,
    scales: {
      x: { type: 'linear', title: { display: true, text: xTitle }, ...xBounds },
      y: { type: logY ? 'logarithmic' : 'linear', title: { display: true, text: yTitle }, ...(logY ? {} : { min: 0 }) },
    },
    plugins: { legend: { position: 'bottom' }, tooltip: { intersect: false, mode: 'nearest' } },
  };
}

export function LineChart(props: LineChartProps): ReactElement {
  const [Line, setLine] = useState<LineComponent | null>(null);
  useEffect(() => {
    let live = true;
    import('./chart-setup')
      .then((module) => {
        if (live) setLine(() => module.Line as unknown as LineComponent);
      })
      .catch(() => undefined);
    return () => {
      live = false;
    };
  }, []);
  return (
    <figure className="tool-chart my-4">
      <div className="relative h-64 w-full" data-chart-ready={Line ? 'true' : 'false'}>
        {Line ? (
          <Line data={chartData(props)} options={chartOptions(props)} aria-label={props.label} role="img" />
        ) : (
          <p className="text-sm text-ink-soft">The chart appears here with JavaScript; the table below has the same figures.</p>
        )}
      </div>
    </figure>
  );
}
