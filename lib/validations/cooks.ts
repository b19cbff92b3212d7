import { localDate } from './menus';
import { z } from 'zod';
import { CHECK_IN_KINDS } from '@/entities/constants';

/** Readings outside this range are refused: below any kitchen's morning, above any store's safe limit [°C]. */
export const READING_MIN_C = -20;
export const READING_MAX_C = 400;

export const idempotencyKey = z.uuid({ message: 'Send a UUID as the idempotency key (a new one per entry, the same one when retrying).' });
const instant = z.iso.datetime({ offset: true, message: 'Give the time as ISO 8601 with an offset, e.g. 2026-12-02T10:15:00+03:00.' });
const temperature = z
  .number({ message: 'A temperature in °C.' })
  .min(READING_MIN_C, `At least ${READING_MIN_C} °C; check the thermometer and the unit.`)
  .max(READING_MAX_C, `At most ${READING_MAX_C} °C; check the thermometer and the unit.`);
const potId = z.string().trim().min(1, 'Choose a pot.').max(40, 'At most 40 characters.');

export const checkInSchema = z.strictObject({
  idempotencyKey,
  planId: z.uuid({ message: 'The plan id (UUID) the slot belongs to.' }),
  batchId: z.string({ message: 'The batch id.' }).min(1, 'The batch id.').max(64, 'At most 64 characters.'),
  kind: z.enum(CHECK_IN_KINDS, { message: `One of: ${CHECK_IN_KINDS.join(', ')}.` }),
  /** When the cook marked it (may be earlier than when it arrives, after being offline); default now. */
  at: instant.optional(),
});
export type CheckInInput = z.infer<typeof checkInSchema>;

export const manualReadingSchema = z
  .strictObject({
    idempotencyKey,
    cookerId: z.uuid({ message: 'Choose a cooker.' }),
    at: instant.optional(),
    storeC: temperature.nullable().optional(),
    potC: temperature.nullable().optional(),
    potId: potId.optional(),
  })
  .refine((v) => v.storeC != null || v.potC != null, { path: ['storeC'], message: 'Enter the store or the pot temperature (or both).' });
export type ManualReadingInput = z.infer<typeof manualReadingSchema>;

export const sensorReadingsSchema = z
  .strictObject({
    idempotencyKey,
    readings: z
      .array(
        z
          .strictObject({ at: instant, storeC: temperature.optional(), potC: temperature.optional(), potId: potId.optional() })
          .refine((r) => r.storeC !== undefined || r.potC !== undefined, { path: ['storeC'], message: 'Each reading needs storeC or potC.' }),
        { message: 'A list of readings.' },
      )
      .min(1, 'Send at least one reading.')
      .max(500, 'At most 500 readings per request.'),
  })
  .superRefine((v, ctx) => {
    for (let i = 1; i < v.readings.length; i++) {
      if (Date.parse(v.readings[i]!.at) <= Date.parse(v.readings[i - 1]!.at)) {
        ctx.addIssue({ code: 'custom', path: ['readings', i, 'at'], message: 'Out of order: each reading must be later than the one before.' });
      }
    }
  });
export type SensorReadingsInput = z.infer<typeof sensorReadingsSchema>;

export const apiKeySchema = z.strictObject({
  label: z.string({ message: 'Name the key, e.g. "store thermocouple".' }).trim().min(1, 'Name the key, e.g. "store thermocouple".').max(100, 'At most 100 characters.'),
});

export const pushSubscriptionSchema = z.strictObject({
  endpoint: z.url({ message: 'The push service address (https) of the subscription.' }).max(2000, 'At most 2000 characters.'),
  keys: z.object({
    // An uncompressed P-256 point (65 bytes → 87 base64url characters) and a 16-byte secret (22).
    p256dh: z.string({ message: 'The subscription key p256dh.' }).regex(/^[A-Za-z0-9_-]{86,88}={0,2}$/, 'p256dh must be a base64url P-256 public key.'),
    auth: z.string({ message: 'The subscription secret auth.' }).regex(/^[A-Za-z0-9_-]{21,24}={0,2}$/, 'auth must be a base64url 16-byte secret.'),
  }),
  expirationTime: z.number().nullable().optional(),
});

export const readingsQuery = z.strictObject({ date: localDate.optional() });
