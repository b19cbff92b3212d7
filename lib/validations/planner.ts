import { z } from 'zod';
import { COOK_METHODS } from '@/entities/constants';
import { cookerBaseSchema } from './cookers';
import { checkSeries } from './simulations';

const iso = z.iso.datetime({ offset: true, message: 'Use an ISO 8601 time with its offset.' });

/** POST /api/v1/planner/solve: a whole planning problem inline, for integrators and what-if studies. */
export const inlineProblemSchema = z
  .strictObject({
    cookers: z
      .array(
        z.strictObject({
          id: z.string().min(1).max(60),
          cooker: cookerBaseSchema,
          initialStoreTempC: z.number().min(-20).max(600),
          weather: z
            .array(z.strictObject({ t: iso, gApertureWm2: z.number().min(0).max(1500), tAirC: z.number().min(-60).max(60), windMS: z.number().min(0).max(60).optional() }))
            .min(60, 'Give at least an hour of 1-minute weather steps.')
            .max(2 * 1440, 'At most two days of 1-minute steps.'),
        }),
      )
      .min(1, 'Give at least one cooker.')
      .max(30, 'At most 30 cookers.'),
    batches: z
      .array(
        z.strictObject({
          id: z.string().min(1).max(60),
          dishName: z.string().min(1).max(200),
          servings: z.number().int().min(1).max(5000),
          method: z.enum(COOK_METHODS),
          potVolumeNeededL: z.number().min(0.1).max(500),
          foodKg: z.number().min(0).max(500),
          foodCpJPerKgK: z.number().min(500).max(5000).default(3500),
          waterKg: z.number().min(0).max(500),
          minTempC: z.number().min(30).max(300),
          holdMin: z.number().min(0).max(600),
          lidOn: z.boolean().default(true),
          earliestStart: iso,
          serveBy: iso,
        }),
      )
      .max(300, 'At most 300 batches.'),
    shifts: z.array(z.strictObject({ start: iso, end: iso })).min(1, 'Give the cooks’ shift.').max(4),
    turnaroundMin: z.number().min(0).max(240).default(15),
    slotMinutes: z.number().int().min(5).max(60).default(15),
    altitudeM: z.number().min(-450).max(6000).default(0),
    timeLimitS: z.number().min(0.2).max(30).default(5),
    timeZone: z.string().max(64).default('UTC'),
  })
  .superRefine((v, ctx) => {
    v.cookers.forEach((c, i) => checkSeries(c.weather.map((s) => s.t), ctx, ['cookers', i, 'weather'], 60_000));
    const ids = new Set<string>();
    v.batches.forEach((b, i) => {
      if (ids.has(b.id)) ctx.addIssue({ code: 'custom', path: ['batches', i, 'id'], message: 'Batch ids must be unique.' });
      ids.add(b.id);
      if (Date.parse(b.serveBy) <= Date.parse(b.earliestStart)) ctx.addIssue({ code: 'custom', path: ['batches', i, 'serveBy'], message: 'Serve-by must be after the earliest start.' });
    });
    v.shifts.forEach((s, i) => {
      if (Date.parse(s.end) <= Date.parse(s.start)) ctx.addIssue({ code: 'custom', path: ['shifts', i, 'end'], message: 'A shift ends after it starts.' });
    });
  });
