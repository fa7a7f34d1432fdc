/**
 * Inputs of the availability routines (METHODS.md §11) for callers that receive them from users or over
 * the wire: a visibility climatology table, and time-stamped visibility records.
 */
import { z } from 'zod';
import { boundedNumber, finiteNumber } from './fields.js';
import { VISIBILITY_DEFINITIONS } from './link-design.schema.js';

const visibilityDefinition = z.enum(VISIBILITY_DEFINITIONS, { error: `must be one of ${VISIBILITY_DEFINITIONS.join(', ')}` });

/** Cumulative visibility distribution P(V < v) of a site; levels strictly increasing. */
export const VisibilityClimatologySchema = z
  .strictObject({
    /** visibility levels [m], strictly increasing */
    visibilityM: z.array(boundedNumber({ greaterThan: 0, atMost: 1e6, unitNote: { upper: '1000 km' } })).min(2, 'needs at least 2 levels'),
    /** P(V < level), non-decreasing, in (0, 1] */
    probabilityBelow: z.array(boundedNumber({ greaterThan: 0, atMost: 1 })).min(2, 'needs at least 2 levels'),
    visibilityDefinition: visibilityDefinition.optional(),
  })
  .superRefine((table, context) => {
    if (table.visibilityM.length !== table.probabilityBelow.length) {
      context.addIssue({ code: 'custom', path: ['probabilityBelow'], message: 'must have one probability per visibility level' });
      return;
    }
    for (let i = 1; i < table.visibilityM.length; i++) {
      if (!(table.visibilityM[i]! > table.visibilityM[i - 1]!)) {
        context.addIssue({ code: 'custom', path: ['visibilityM', i], message: 'must be greater than the previous level' });
      }
      if (table.probabilityBelow[i]! < table.probabilityBelow[i - 1]!) {
        context.addIssue({ code: 'custom', path: ['probabilityBelow', i], message: 'must not be less than the previous probability' });
      }
    }
  });
export type VisibilityClimatologyInput = z.input<typeof VisibilityClimatologySchema>;

/**
 * Visibility records of a site. Missing readings may be sent as null (they count as missing data);
 * timestamps, when given, are milliseconds since the epoch and strictly increasing.
 */
export const VisibilityRecordsSchema = z
  .strictObject({
    visibilityM: z.array(finiteNumber().nullable()).min(1, 'needs at least one record').max(1_000_000, 'at most 1 000 000 records'),
    timestampsMs: z.array(finiteNumber()).optional(),
    visibilityDefinition: visibilityDefinition.optional(),
  })
  .superRefine((records, context) => {
    if (!records.timestampsMs) return;
    if (records.timestampsMs.length !== records.visibilityM.length) {
      context.addIssue({ code: 'custom', path: ['timestampsMs'], message: 'must have one timestamp per visibility record' });
      return;
    }
    for (let i = 1; i < records.timestampsMs.length; i++) {
      if (!(records.timestampsMs[i]! > records.timestampsMs[i - 1]!)) {
        context.addIssue({ code: 'custom', path: ['timestampsMs', i], message: 'timestamps must increase strictly' });
        return;
      }
    }
  });
export type VisibilityRecordsInput = z.input<typeof VisibilityRecordsSchema>;
