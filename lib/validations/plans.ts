import { z } from 'zod';
import { clock, localDate } from './menus';
import { STOVES } from '@/lib/fuel';

export const solvePlanSchema = z.strictObject({
  date: localDate,
  timeLimitS: z.number().min(0.5, 'At least 0.5 s.').max(60, 'At most 60 s.').default(5),
});

export const patchSlotSchema = z.strictObject({
  cookerId: z.uuid({ message: 'Choose a cooker.' }),
  potId: z.string().min(1, 'Choose a pot.').max(40),
  start: z.iso.datetime({ offset: true, message: 'Give the new start as an ISO 8601 time with offset.' }),
});

const STOVE_IDS = Object.keys(STOVES) as [string, ...string[]];
export const planningSettingsSchema = z
  .strictObject({
    shiftStart: clock,
    shiftEnd: clock,
    turnaroundMin: z.number().int().min(0, 'At least 0 min.').max(240, 'At most 240 min.'),
    currency: z.string().trim().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code, e.g. KES or XOF.'),
    fuels: z
      .array(
        z.strictObject({
          stoveId: z.enum(STOVE_IDS, { message: `Stove is one of: ${STOVE_IDS.join(', ')}.` }),
          efficiency: z.number().min(0.02, 'At least 2 %.').max(0.95, 'At most 95 %.').optional(),
          price: z.number().min(0, 'A price cannot be negative.').max(1e6).optional(),
        }),
      )
      .min(1, 'Keep at least one backup stove.')
      .max(10),
  })
  .superRefine((v, ctx) => {
    if (v.shiftEnd <= v.shiftStart) ctx.addIssue({ code: 'custom', path: ['shiftEnd'], message: 'The shift must end after it starts.', params: { i18n: 'shiftEndAfterStart' } });
  });

export const overviewQuery = z.strictObject({ date: localDate });

/** The inline problem of POST /api/v1/planner/solve (for integrators and what-if studies). */
export { clock, localDate };
