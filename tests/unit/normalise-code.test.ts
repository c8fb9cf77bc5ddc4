import { describe, expect, it } from 'vitest';
import { normaliseCode } from '@/lib/schemas/catalogue';

describe('normaliseCode', () => {
  it('drops dashes, spaces and case so loosely typed model numbers meet', () => {
    expect(normaliseCode('DV-4120K')).toBe('dv4120k');
    expect(normaliseCode('dv 4120k')).toBe('dv4120k');
    expect(normaliseCode('KX/44.N')).toBe('kx44n');
  });
  it('keeps digits apart from letters so neighbouring codes stay distinct', () => {
    expect(normaliseCode('KX-44N')).not.toBe(normaliseCode('KX-45N'));
  });
});
