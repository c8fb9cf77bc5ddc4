// A job sheet: one repair on a member's bench, created whole and edited field by field.
import { z } from 'zod';
import { slugSchema } from './slug';
import { orderLineInputSchema } from '@/lib/bench/order-list';
import { MAX_JOB_PARTS } from '@/lib/bench/job-parts';

export const jobStatuses = ['booked_in', 'diagnosing', 'waiting_for_parts', 'repaired', 'collected', 'returned_unrepaired'] as const;
export const jobStatusSchema = z.enum(jobStatuses, { error: 'Choose a status from the list.' });
export type JobStatus = z.infer<typeof jobStatusSchema>;

export const jobStatusLabels: Record<JobStatus, string> = {
  booked_in: 'Booked in',
  diagnosing: 'Diagnosing',
  waiting_for_parts: 'Waiting for parts',
  repaired: 'Repaired',
  collected: 'Collected',
  returned_unrepaired: 'Returned unrepaired',
};

/** A part used on a job: the order list's line shape; the source is filled in from the job sheet. */
export const jobPartSchema = orderLineInputSchema.extend({
  source: z.string().trim().max(200).default(''),
});
export type JobPart = z.output<typeof jobPartSchema>;

const jobSheetFields = {
  customerRef: z
    .string({ error: 'Give a customer reference, e.g. an invoice or ticket number.' })
    .trim()
    .min(1, 'Give a customer reference, e.g. an invoice or ticket number.')
    .max(120, 'Keep the customer reference under 120 characters.'),
  /** A machine from the catalogue by its slug, or null when it is not in the catalogue. */
  machine: slugSchema.nullable(),
  serialNumber: z.string().trim().max(80, 'Keep the serial number under 80 characters.'),
  reportedSymptom: z.string().trim().max(2000, 'Keep the reported symptom under 2000 characters.'),
  findings: z.string().trim().max(4000, 'Keep the findings under 4000 characters.'),
  partsUsed: z.array(jobPartSchema).max(MAX_JOB_PARTS, `A job sheet holds at most ${MAX_JOB_PARTS} part lines.`),
  labourMinutes: z
    .number({ error: 'Give labour in whole minutes.' })
    .int('Give labour in whole minutes.')
    .min(0, 'Labour cannot be negative.')
    .max(100_000, 'Labour above 100000 minutes is not one job.'),
  status: jobStatusSchema,
  outcome: z.string().trim().max(2000, 'Keep the outcome under 2000 characters.'),
};

export const jobSheetCreateSchema = z.object({
  customerRef: jobSheetFields.customerRef,
  machine: jobSheetFields.machine.default(null),
  serialNumber: jobSheetFields.serialNumber.default(''),
  reportedSymptom: jobSheetFields.reportedSymptom.default(''),
  findings: jobSheetFields.findings.default(''),
  partsUsed: jobSheetFields.partsUsed.default([]),
  labourMinutes: jobSheetFields.labourMinutes.default(0),
  status: jobSheetFields.status.default('booked_in'),
  outcome: jobSheetFields.outcome.default(''),
});
export type JobSheetCreate = z.output<typeof jobSheetCreateSchema>;

export const jobSheetPatchSchema = z.object(jobSheetFields).partial();
export type JobSheetPatch = z.output<typeof jobSheetPatchSchema>;
export type JobSheetCreateInput = z.input<typeof jobSheetCreateSchema>;
export type JobSheetPatchInput = z.input<typeof jobSheetPatchSchema>;
