// Input schema and result types of the electrolytic capacitor substitute check.
import { z } from 'zod';
import { figures, positiveNumber, temperatureC, yesOrNo } from './numbers';

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

const percent = (what: string) => z.number({ error: `${what} is a number of percent, e.g. 20.` });

export const capacitorSpecSchema = figures(
  {
    capacitanceF: positiveNumber('Capacitance'),
    tolerance: figures(
      {
        minusPercent: percent('Tolerance below')
          .min(0, 'Tolerance cannot be negative, e.g. 20.')
          .max(100, 'Tolerance below -100 % is not possible; e.g. 20.'),
        plusPercent: percent('Tolerance above')
          .min(0, 'Tolerance cannot be negative, e.g. 20.')
          .max(1000, 'Tolerance above +1000 % is not a marking; e.g. 80.'),
      },
      'minus 20 % and plus 20 %',
    ).optional(),
    ratedVoltageV: positiveNumber('Rated voltage'),
    temperatureC: temperatureC('Temperature class').optional(),
    lowEsr: yesOrNo('Low-ESR').optional(),
    rippleCurrentA: positiveNumber('Ripple current').optional(),
    diameterMm: positiveNumber('Can diameter').optional(),
    heightMm: positiveNumber('Can height').optional(),
    leadPitchMm: positiveNumber('Lead pitch').optional(),
    polarity: z.enum(['polarised', 'bipolar'], { error: 'Polarity is polarised or bipolar.' }).optional(),
  },
  'capacitance 470 µF and rated voltage 16 V',
);
export type CapacitorSpec = z.output<typeof capacitorSpecSchema>;

export const substituteInputSchema = figures(
  {
    original: capacitorSpecSchema,
    candidate: capacitorSpecSchema,
    /** DC working voltage across the part in the circuit, when measured or known from the schematic. */
    workingVoltageV: positiveNumber('Working voltage').optional(),
    /** Room on the board, when measured; without it the original's size is the limit. */
    space: figures(
      {
        maxDiameterMm: positiveNumber('Room for the diameter').optional(),
        maxHeightMm: positiveNumber('Room for the height').optional(),
      },
      'room for a diameter of 10 mm and a height of 20 mm',
    ).optional(),
  },
  'original 470 µF 16 V and candidate 470 µF 25 V',
);
export type SubstituteInput = z.input<typeof substituteInputSchema>;
