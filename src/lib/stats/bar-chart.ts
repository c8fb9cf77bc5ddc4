// Geometry of a horizontal bar chart for counts: a nice axis, bar lengths and positions. Pure, no DOM.

export type BarTone = 'teal' | 'teal-dark' | 'amber' | 'brick' | 'ink-soft';

export interface BarDatum {
  label: string;
  value: number;
  /** Where a click on the bar leads (a fix page); optional. */
  href?: string;
  tone?: BarTone;
}

export interface ChartOptions {
  width: number;
  /** Height of one bar. */
  barHeight: number;
  /** Room above each bar for its label. */
  labelHeight: number;
  gap: number;
  /** Room on the right for the value printed after the bar. */
  valueRoom: number;
  /** Longest label in characters before it is shortened with an ellipsis. */
  maxLabelChars: number;
  targetTicks: number;
}

export const defaultChartOptions: ChartOptions = {
  width: 560,
  barHeight: 18,
  labelHeight: 18,
  gap: 10,
  valueRoom: 40,
  maxLabelChars: 70,
  targetTicks: 5,
};

export interface BarGeometry {
  label: string;
  /** The label as drawn: shortened when too long (the full label goes in a <title>). */
  shownLabel: string;
  value: number;
  href?: string;
  tone: BarTone;
  labelY: number;
  barY: number;
  barWidth: number;
}

export interface ChartGeometry {
  width: number;
  height: number;
  plotWidth: number;
  axisY: number;
  /** The axis runs from 0 to domainMax, a tick value at or above the largest count. */
  domainMax: number;
  ticks: { value: number; x: number }[];
  bars: BarGeometry[];
}

/**
 * Tick step for counts: the smallest of 1, 2 or 5 times a power of ten that gives at most about
 * `target` intervals, never below 1 (counts are whole). The same 1-2-5 rule as d3-array's ticks.
 */
export function countTickStep(max: number, target: number): number {
  if (!(max > 0) || !(target >= 1)) return 1;
  const raw = max / target;
  const power = Math.pow(10, Math.floor(Math.log10(raw)));
  const error = raw / power;
  // d3-array's thresholds: √50, √10, √2 between the 10, 5, 2 and 1 multiples.
  const factor = error >= Math.sqrt(50) ? 10 : error >= Math.sqrt(10) ? 5 : error >= Math.sqrt(2) ? 2 : 1;
  return Math.max(1, factor * power);
}

/** Tick values from 0 up to the first tick at or above `max`. */
export function countTicks(max: number, target: number): number[] {
  const step = countTickStep(max, target);
  const top = Math.max(step, Math.ceil(Math.max(0, max) / step) * step);
  const ticks: number[] = [];
  for (let i = 0; i * step <= top + step / 1e9; i++) ticks.push(i * step);
  return ticks;
}

export function shortenLabel(label: string, maxChars: number): string {
  const chars = [...label];
  if (chars.length <= maxChars) return label;
  return `${chars
    .slice(0, Math.max(1, maxChars - 1))
    .join('')
    .trimEnd()}…`;
}

/** Lays out bars top to bottom in the order given; negative or non-finite values are drawn as 0. */
export function layoutBarChart(data: readonly BarDatum[], options: Partial<ChartOptions> = {}): ChartGeometry {
  const o: ChartOptions = { ...defaultChartOptions, ...options };
  const values = data.map((d) => (Number.isFinite(d.value) && d.value > 0 ? d.value : 0));
  const ticksValues = countTicks(Math.max(0, ...values), o.targetTicks);
  const domainMax = ticksValues[ticksValues.length - 1] ?? 1;
  const plotWidth = Math.max(1, o.width - o.valueRoom);
  const rowHeight = o.labelHeight + o.barHeight + o.gap;
  const bars: BarGeometry[] = data.map((d, i) => {
    const value = values[i] ?? 0;
    return {
      label: d.label,
      shownLabel: shortenLabel(d.label, o.maxLabelChars),
      value,
      ...(d.href ? { href: d.href } : {}),
      tone: d.tone ?? 'teal',
      labelY: i * rowHeight + o.labelHeight - 5,
      barY: i * rowHeight + o.labelHeight,
      barWidth: (value / domainMax) * plotWidth,
    };
  });
  const axisY = data.length * rowHeight;
  return {
    width: o.width,
    height: axisY + 22,
    plotWidth,
    axisY,
    domainMax,
    ticks: ticksValues.map((value) => ({ value, x: (value / domainMax) * plotWidth })),
    bars,
  };
}
