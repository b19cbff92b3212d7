import { localDate } from './menus';
import { z } from 'zod';
import { COOKER_KINDS, TRACKING_MODES } from '@/entities/constants';
import { hasMedium, listMediumIds } from '@/lib/materials';

const num = (what: string, min: number, max: number, unit: string) =>
  z
    .number({ message: `${what} is a number (${unit}).` })
    .min(min, `${what} is at least ${min} ${unit}.`)
    .max(max, `${what} is at most ${max} ${unit}.`);

export const potSchema = z.strictObject({
  id: z.string().trim().min(1, 'Give the pot a short id.').max(40).optional(),
  name: z.string().trim().min(1, 'Name the pot (e.g. "Pot 1, 40 L").').max(80, 'At most 80 characters.'),
  volumeL: num('Pot volume', 1, 500, 'L'),
  massKg: num('Empty pot mass', 0.1, 200, 'kg'),
  cpJPerKgK: num('Pot specific heat', 300, 1000, 'J/(kg·K)').default(900),
  coupling: z.discriminatedUnion('kind', [
    z.strictObject({ kind: z.literal('constant'), uaWPerK: num('Store-to-pot conductance', 0.5, 2000, 'W/K') }),
    z.strictObject({ kind: z.literal('natural-convection'), contactAreaM2: num('Pot contact area', 0.01, 5, 'm²') }),
  ]),
  lidAreaM2: num('Lid area', 0.005, 5, 'm²'),
  lidUWPerM2K: num('Lid loss coefficient', 0.5, 100, 'W/(m²·K)'),
});

/**
 * A cooker's fields as they are checked, without defaults: a PATCH must not fill in what it does not
 * name (zod 4 applies a default inside .optional() to a missing key).
 */
const cookerFieldChecks = z.strictObject({
  name: z.string({ message: 'Name the cooker.' }).trim().min(1, 'Name the cooker.').max(200, 'At most 200 characters.'),
  kind: z.enum(COOKER_KINDS, { message: `Kind is one of: ${COOKER_KINDS.join(', ')}.` }),
  apertureM2: num('Aperture area', 0.05, 200, 'm²'),
  tracking: z.enum(TRACKING_MODES, { message: `Tracking is one of: ${TRACKING_MODES.join(', ')}.` }),
  tiltDeg: num('Tilt', 0, 90, '°'),
  surfaceAzimuthDeg: num('Azimuth', 0, 360, '° east of north'),
  collectorModel: z.enum(['iso9806', 'lumped'], { message: 'Collector model is iso9806 or lumped.' }),
  eta0: num('Optical efficiency', 0.05, 0.95, '(fraction)'),
  a1: num('Loss coefficient a1', 0, 50, 'W/(m²·K)'),
  a2: num('Loss coefficient a2', 0, 1, 'W/(m²·K²)'),
  uLossWPerK: num('Collector loss', 0, 500, 'W/K'),
  mediumId: z.string({ message: 'Choose the store medium.' }).refine((id) => id === 'custom' || hasMedium(id), {
    message: `Unknown store medium; choose one of: ${listMediumIds().join(', ')}, or custom.`,
    params: { i18n: 'medium' },
  }),
  customMediumId: z.uuid({ message: 'Choose a custom medium.' }).nullable().optional(),
  storeMassKg: num('Store mass', 1, 50000, 'kg'),
  storeUaWPerK: num('Store heat-loss conductance', 0.01, 200, 'W/K'),
  storeNodes: z.number().int('Store layers is a whole number.').min(1, 'At least 1 layer.').max(50, 'At most 50 layers.'),
  maxSafeTempC: num('Highest safe store temperature', 40, 400, '°C'),
  minUsefulTempC: num('Lowest useful store temperature', 20, 350, '°C'),
  pots: z.array(potSchema).min(1, 'Add at least one pot.').max(12, 'At most 12 pots.'),
});

/** A cooker as the lead enters it; every number with its unit and its range explained. The loss terms default to 0, one layer. */
export const cookerBaseSchema = cookerFieldChecks.extend({
  a1: cookerFieldChecks.shape.a1.default(0),
  a2: cookerFieldChecks.shape.a2.default(0),
  uLossWPerK: cookerFieldChecks.shape.uLossWPerK.default(0),
  storeNodes: cookerFieldChecks.shape.storeNodes.default(1),
});

function refineCooker(v: Partial<z.infer<typeof cookerBaseSchema>>, ctx: z.RefinementCtx) {
  if (v.maxSafeTempC !== undefined && v.minUsefulTempC !== undefined && v.minUsefulTempC >= v.maxSafeTempC - 5) {
    ctx.addIssue({ code: 'custom', path: ['minUsefulTempC'], message: 'The lowest useful temperature must be at least 5 °C below the highest safe one.', params: { i18n: 'usefulBelowSafe' } });
  }
  if (v.mediumId === 'custom' && !v.customMediumId) {
    ctx.addIssue({ code: 'custom', path: ['customMediumId'], message: 'Choose the custom medium, or a built-in one.', params: { i18n: 'customMedium' } });
  }
  if (v.collectorModel === 'lumped' && v.uLossWPerK === 0 && v.a1 === 0) {
    // Allowed (an ideal collector) but almost never real; the UI warns, the API accepts.
  }
  const ids = new Set<string>();
  v.pots?.forEach((p, i) => {
    const id = p.id ?? `pot-${i + 1}`;
    if (ids.has(id)) ctx.addIssue({ code: 'custom', path: ['pots', i, 'id'], message: 'Each pot needs its own id.', params: { i18n: 'potIdsUnique' } });
    ids.add(id);
  });
}

export const createCookerSchema = cookerBaseSchema.superRefine(refineCooker);
export const updateCookerSchema = cookerFieldChecks
  .partial()
  .superRefine(refineCooker)
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one field to change.' })
  .meta({ minProperties: 1 });
export type CookerInput = z.infer<typeof createCookerSchema>;

export const customMediumSchema = z.strictObject({
  name: z.string().trim().min(1, 'Name the medium.').max(200),
  smokePointC: num('Smoke point', 50, 500, '°C').nullable().optional(),
  source: z.string().trim().max(500).nullable().optional(),
  rows: z
    .array(
      z.strictObject({
        tC: num('Temperature', -50, 600, '°C'),
        density: num('Density', 100, 5000, 'kg/m³'),
        cp: num('Specific heat', 100, 10000, 'J/(kg·K)'),
        k: num('Conductivity', 0.01, 100, 'W/(m·K)'),
        viscosity: num('Viscosity', 0, 100, 'Pa·s'),
      }),
    )
    .min(2, 'Give at least two rows (two temperatures).')
    .max(200, 'At most 200 rows.')
    .superRefine((rows, ctx) => {
      rows.forEach((r, i) => {
        const prev = rows[i - 1];
        if (i > 0 && prev && r.tC <= prev.tC) ctx.addIssue({ code: 'custom', path: [i, 'tC'], message: `Row ${i + 1}: temperatures must increase from row to row.` });
      });
    }),
});

export const predictionQuerySchema = z.strictObject({
  date: localDate.optional(),
  initialStoreTempC: z.coerce.number({ message: 'Starting store temperature is a number (°C).' }).min(-20).max(400).optional(),
});
