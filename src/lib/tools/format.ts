// Display forms of the tools' results; every formatter answers "—" rather than NaN, Infinity or "undefined".
import { formatMagnitude } from '@/lib/values/format-value';
import { roundSignificant } from '@/lib/values/decimal';
import type { Quantity } from '@/lib/values/quantities';
import { unitOf } from '@/lib/values/quantities';

export const NOT_A_NUMBER = '—';

const grouped = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

function finite(x: number | undefined): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

/** Three significant figures, no exponent: 0.246, 122, 70.5. */
export function significant(x: number | undefined, figures = 3): string {
  if (!finite(x)) return NOT_A_NUMBER;
  const rounded = roundSignificant(x, figures);
  return Math.abs(rounded) >= 1e4 ? grouped.format(rounded) : String(rounded);
}

/** A value of a quantity with its canonical prefix, to three significant figures: "150 µF", "0.246 W". */
export function quantityText(x: number | undefined, quantity: Quantity, figures = 3): string {
  if (!finite(x)) return NOT_A_NUMBER;
  return formatMagnitude({ quantity, magnitude: roundSignificant(x, figures), unit: unitOf[quantity] });
}

/** Seconds, with minutes and hours beside long times: "122 s (2 min 2 s)". */
export function duration(seconds: number | undefined): string {
  if (!finite(seconds)) return NOT_A_NUMBER;
  const plain = `${significant(seconds)} s`;
  if (seconds < 60) return plain;
  const whole = Math.round(seconds);
  const hours = Math.floor(whole / 3600);
  const minutes = Math.floor((whole % 3600) / 60);
  const rest = whole % 60;
  const parts = [hours > 0 ? `${hours} h` : '', minutes > 0 ? `${minutes} min` : '', rest > 0 && hours === 0 ? `${rest} s` : ''];
  return `${plain} (${parts.filter((p) => p !== '').join(' ')})`;
}

/** Energy in J, mJ or µJ to three significant figures. */
export function energy(joules: number | undefined): string {
  if (!finite(joules)) return NOT_A_NUMBER;
  if (joules === 0) return '0 J';
  if (joules >= 1) return `${significant(joules)} J`;
  if (joules >= 1e-3) return `${significant(joules * 1e3)} mJ`;
  return `${significant(joules * 1e6)} µJ`;
}

/** Hours as a whole number with thousands separators: "8,000 h". */
export function hours(h: number | undefined): string {
  return finite(h) ? `${grouped.format(Math.round(h))} h` : NOT_A_NUMBER;
}

/** Years to one decimal: "0.9 years", "3.7 years". */
export function years(y: number | undefined): string {
  if (!finite(y)) return NOT_A_NUMBER;
  const rounded = Math.round(y * 10) / 10;
  return `${rounded} ${rounded === 1 ? 'year' : 'years'}`;
}

export function percent(p: number | undefined, figures = 3): string {
  return finite(p) ? `${p > 0 ? '+' : ''}${significant(p, figures)} %` : NOT_A_NUMBER;
}

export function celsius(c: number | undefined): string {
  return finite(c) ? `${significant(c, 4)} °C` : NOT_A_NUMBER;
}
