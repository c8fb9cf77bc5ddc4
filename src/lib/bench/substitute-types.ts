// Input schema and result types of the electrolytic capacitor substitute check.
import { z } from 'zod';
import { positiveNumber, temperatureC } from './numbers';

export const checkStatuses = ['pass', 'warn', 'fail'] as const;
export type CheckStatus = (typeof checkStatuses)[number];

export type CheckName =
  'capacitance' | 'ratedVoltage' | 'headroom' | 'temperature' | 'lowEsr' | 'ripple' | 'diameter' | 'height' | 'leadPitch' | 'polarity';

export interface SubstituteCheck {
  check: CheckName;
  status: CheckStatus;
  /** Plain words, with the figures compared. */
  reason: string;
}

export interface SubstituteResult {
  /** The worst of the checks. */
  verdict: CheckStatus;
  checks: SubstituteCheck[];
}

export const capacitorSpecSchema = z.object({
  capacitanceF: positiveNumber('Capacitance'),
  tolerance: z
    .object({
      minusPercent: z.number().min(0, 'Tolerance cannot be negative.').max(100, 'Tolerance below -100 % is not possible.'),
      plusPercent: z.number().min(0, 'Tolerance cannot be negative.').max(1000, 'Tolerance above +1000 % is not a marking.'),
    })
    .optional(),
  ratedVoltageV: positiveNumber('Rated voltage'),
  temperatureC: temperatureC('Temperature class').optional(),
  lowEsr: z.boolean().optional(),
  rippleCurrentA: positiveNumber('Ripple current').optional(),
  diameterMm: positiveNumber('Can diameter').optional(),
  heightMm: positiveNumber('Can height').optional(),
  leadPitchMm: positiveNumber('Lead pitch').optional(),
  polarity: z.enum(['polarised', 'bipolar']).optional(),
});
export type CapacitorSpec = z.output<typeof capacitorSpecSchema>;

export const substituteInputSchema = z.object({
  original: capacitorSpecSchema,
  candidate: capacitorSpecSchema,
  /** DC working voltage across the part in the circuit, when measured or known from the schematic. */
  workingVoltageV: positiveNumber('Working voltage').optional(),
  /** Room on the board, when measured; without it the original's size is the limit. */
  space: z
    .object({
      maxDiameterMm: positiveNumber('Room for the diameter').optional(),
      maxHeightMm: positiveNumber('Room for the height').optional(),
    })
    .optional(),
});
export type SubstituteInput = z.input<typeof substituteInputSchema>;
