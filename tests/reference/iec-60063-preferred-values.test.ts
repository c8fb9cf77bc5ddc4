// Reference checks of the preferred number series against IEC 60063:2015's tables.
import { describe, expect, it } from 'vitest';
import { nearestPreferred, seriesValues } from '@/lib/bench/preferred-values';
import { publishedE192, publishedE48, publishedE96 } from './iec-60063-table';

const twoFigures = (values: readonly number[]): number[] => values.map((v) => Math.round(v * 10));

describe('IEC 60063 preferred number series', () => {
  it('E6 is 10 15 22 33 47 68', () => {
    expect(twoFigures(seriesValues('E6'))).toEqual([10, 15, 22, 33, 47, 68]); // IEC 60063:2015, table of E6
  });

  it('E3 is 10 22 47', () => {
    expect(twoFigures(seriesValues('E3'))).toEqual([10, 22, 47]); // IEC 60063:2015, table of E3
  });

  it('E12 adds 12 18 27 39 56 82 to E6', () => {
    const added = twoFigures(seriesValues('E12')).filter((v) => !twoFigures(seriesValues('E6')).includes(v));
    expect(added).toEqual([12, 18, 27, 39, 56, 82]); // IEC 60063:2015, table of E12
  });

  it('E24 adds 11 13 16 20 24 30 36 43 51 62 75 91 to E12', () => {
    const added = twoFigures(seriesValues('E24')).filter((v) => !twoFigures(seriesValues('E12')).includes(v));
    expect(added).toEqual([11, 13, 16, 20, 24, 30, 36, 43, 51, 62, 75, 91]); // IEC 60063:2015, table of E24
  });

  it('E24 is a table: it departs from 10^(i/24) at 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2', () => {
    const e24 = seriesValues('E24');
    const departures = e24.filter((v, i) => Number((10 ** (i / 24)).toPrecision(2)) !== v);
    expect(departures).toEqual([2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 8.2]); // IEC 60063:2015; the rule gives 2.6 2.9 3.2 3.5 3.8 4.2 4.6 8.3
  });

  it('E48 equals the published table', () => {
    expect(seriesValues('E48')).toEqual(publishedE48); // IEC 60063:2015 E48 table (reproduced copy)
  });

  it('E96 equals the published table', () => {
    expect(seriesValues('E96')).toEqual(publishedE96); // IEC 60063:2015 E96 table (reproduced copy)
  });

  it('E192 equals the published table, 9.20 included where the rule gives 9.19', () => {
    expect(seriesValues('E192')).toEqual(publishedE192); // IEC 60063:2015 E192 table (reproduced copy)
    expect(Number((10 ** (185 / 192)).toPrecision(3))).toBe(9.19); // the rule's own figure at that step
    expect(seriesValues('E192')[185]).toBe(9.2); // the table's exception
  });

  it('places the E24 value 5.1 kΩ between the E12 values 4.7 kΩ and 5.6 kΩ', () => {
    // IEC 60063:2015 E12 and E24 tables: 51 is in E24 only; its E12 neighbours are 47 and 56
    expect(nearestPreferred(5100, 'E12')).toMatchObject({ ok: true, value: { below: 4700, above: 5600 } });
    expect(nearestPreferred(5100, 'E24')).toMatchObject({ ok: true, value: { nearest: 5100, errorPercent: 0 } });
  });
});
