import { z } from 'zod';
import { UPLOAD_MODES } from '@/entities/constants';

const date = z
  .string({ message: 'Give the day as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date as YYYY-MM-DD.')
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Not a real date.');

/** GET /api/v1/kitchens/{kitchenId}/forecast */
export const forecastQuerySchema = z.strictObject({
  date: date.optional().describe("Local date in the kitchen's time zone; today by default"),
});

/** The text fields of POST /api/v1/kitchens/{kitchenId}/forecast/uploads (multipart). */
export const forecastUploadFieldsSchema = z.strictObject({
  date: date.describe("The local day the weather is for, in the kitchen's time zone"),
  mode: z.enum(UPLOAD_MODES, { message: `Mode is one of: ${UPLOAD_MODES.join(', ')}.` }).default('as-is'),
});

/** The multipart form as documented in the OpenAPI document. */
export const forecastUploadFormSchema = forecastUploadFieldsSchema.extend({
  file: z
    .file()
    .describe(
      'CSV (header: time,ghi_w_m2[,dni_w_m2,dhi_w_m2,temp_c,wind_m_s,cloud_okta]; time ISO 8601 with offset, start of the hour) or EnergyPlus EPW; at most 5 MB',
    ),
});

/** Monthly clear-sky index, January … December. */
export const clearnessSchema = z
  .array(z.number({ message: 'Each month is a number from 0.05 to 1.' }).min(0.05, 'At least 0.05.').max(1, 'At most 1 (clear sky).'), {
    message: 'Give 12 monthly values, January to December.',
  })
  .length(12, 'Give 12 monthly values, January to December.');
