import { z } from 'zod';
import { cookerBaseSchema } from './cookers';

const isoTime = z.iso.datetime({ offset: true, message: 'Use an ISO 8601 time with its offset, e.g. 2026-12-03T08:00:00+03:00.' });
const MAX_STEPS = 14 * 1440;

const apertureWeather = z.strictObject({
  kind: z.literal('aperture'),
  steps: z
    .array(
      z.strictObject({
        t: isoTime,
        gApertureWm2: z.number({ message: 'Irradiance is a number (W/m²).' }).min(0, 'Irradiance cannot be negative.').max(1500, 'Irradiance above 1500 W/m² is not physical.'),
        tAirC: z.number({ message: 'Air temperature is a number (°C).' }).min(-60).max(60),
        windMS: z.number().min(0).max(60).optional(),
      }),
    )
    .min(2, 'Give at least two weather steps.')
    .max(MAX_STEPS, `At most ${MAX_STEPS} steps (14 days of minutes).`),
});

const hourlyWeather = z.strictObject({
  kind: z.literal('hourly'),
  hours: z
    .array(
      z.strictObject({
        t: isoTime,
        ghiWm2: z.number().min(0).max(1500).optional(),
        dniWm2: z.number().min(0).max(1500).optional(),
        dhiWm2: z.number().min(0).max(1000).optional(),
        cloudOkta: z.number().min(0).max(8).optional(),
        tAirC: z.number().min(-60).max(60),
        windMS: z.number().min(0).max(60).optional(),
      }),
    )
    .min(2, 'Give at least two hours.')
    .max(24 * 14, 'At most 14 days of hours.'),
});

/** Checks that times increase by one equal step with no gap; names the first bad row. */
export function checkSeries(times: string[], ctx: z.RefinementCtx, path: (string | number)[], expectMs?: number) {
  const ms = times.map((t) => Date.parse(t));
  const step = expectMs ?? (ms[1]! - ms[0]!);
  if (!(step > 0)) {
    ctx.addIssue({ code: 'custom', path: [...path, 1, 't'], message: 'Times must increase.' });
    return;
  }
  for (let i = 1; i < ms.length; i++) {
    const d = ms[i]! - ms[i - 1]!;
    if (d <= 0) {
      ctx.addIssue({ code: 'custom', path: [...path, i, 't'], message: `Row ${i + 1} is not after row ${i}: sort the series by time.` });
      return;
    }
    if (d !== step) {
      ctx.addIssue({ code: 'custom', path: [...path, i, 't'], message: `Row ${i + 1} leaves a gap or uneven step (${d / 1000} s instead of ${step / 1000} s).` });
      return;
    }
  }
}

export const simulationSchema = z
  .strictObject({
    cookerId: z.uuid({ message: 'cookerId is an id (UUID).' }).optional(),
    cooker: cookerBaseSchema.optional(),
    site: z
      .strictObject({
        latitude: z.number().min(-90).max(90),
        longitude: z.number().min(-180).max(180),
        altitudeM: z.number().min(-450).max(6000),
      })
      .optional(),
    weather: z.discriminatedUnion('kind', [apertureWeather, hourlyWeather], { message: 'weather.kind is "aperture" (steps on the aperture) or "hourly" (hours of weather).' }),
    initialStoreTempC: z.number({ message: 'Starting store temperature is a number (°C).' }).min(-20).max(600),
    altitudeM: z.number().min(-450).max(6000).optional(),
    loads: z
      .array(
        z.strictObject({
          id: z.string().min(1).max(60),
          potId: z.string().min(1).max(40),
          start: isoTime,
          foodKg: z.number().min(0).max(500),
          foodCpJPerKgK: z.number().min(500).max(5000).default(3500),
          waterKg: z.number().min(0).max(500),
          lidOn: z.boolean().default(true),
          minTempC: z.number().min(20).max(300),
          holdS: z.number().min(0).max(24 * 3600),
          maxEnd: isoTime,
        }),
      )
      .max(200)
      .default([]),
    outputStepMin: z.number().int().min(1).max(60).default(10),
  })
  .superRefine((v, ctx) => {
    if (!v.cookerId === !v.cooker) ctx.addIssue({ code: 'custom', path: ['cooker'], message: 'Give either cookerId or an inline cooker, not both or neither.' });
    if (v.weather.kind === 'aperture') checkSeries(v.weather.steps.map((s) => s.t), ctx, ['weather', 'steps']);
    else {
      checkSeries(v.weather.hours.map((s) => s.t), ctx, ['weather', 'hours'], 3_600_000);
      if (!v.site && !v.cookerId) ctx.addIssue({ code: 'custom', path: ['site'], message: 'Hourly weather needs the site (latitude, longitude, altitude) for the sun position.' });
      v.weather.hours.forEach((h, i) => {
        if (h.ghiWm2 === undefined && h.cloudOkta === undefined && (h.dniWm2 === undefined || h.dhiWm2 === undefined))
          ctx.addIssue({ code: 'custom', path: ['weather', 'hours', i], message: `Hour ${i + 1}: give ghiWm2, or dniWm2 and dhiWm2, or cloudOkta.` });
      });
    }
    if (v.cooker && v.cooker.minUsefulTempC >= v.cooker.maxSafeTempC - 5)
      ctx.addIssue({ code: 'custom', path: ['cooker', 'minUsefulTempC'], message: 'Must be at least 5 °C below the highest safe temperature.' });
    if (v.cooker?.mediumId === 'custom' && !v.cooker.customMediumId)
      ctx.addIssue({ code: 'custom', path: ['cooker', 'customMediumId'], message: 'Choose the custom medium (customMediumId), or a built-in one.' });
  });

export type SimulationInput = z.infer<typeof simulationSchema>;
