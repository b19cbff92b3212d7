import { z } from 'zod';
import { displayName, locale } from './common';
import { clearnessSchema } from './forecast';

function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

export const kitchenFields = {
  name: displayName(),
  latitude: z.number({ message: 'Latitude is a number of degrees.' }).min(-90, 'Latitude is between −90 and 90°.').max(90, 'Latitude is between −90 and 90°.'),
  longitude: z.number({ message: 'Longitude is a number of degrees.' }).min(-180, 'Longitude is between −180 and 180°.').max(180, 'Longitude is between −180 and 180°.'),
  altitudeM: z.number({ message: 'Altitude is a number of metres.' }).min(-450, 'Altitude is at least −450 m.').max(6000, 'Altitude is at most 6000 m.'),
  timeZone: z.string({ message: 'Enter a time zone.' }).refine(isTimeZone, { message: 'Use an IANA time zone such as Africa/Nairobi.', params: { i18n: 'timeZone' } }),
  locale,
};

export const createKitchenSchema = z.strictObject(kitchenFields);
export const updateKitchenSchema = z
  .strictObject({
    name: kitchenFields.name.optional(),
    latitude: kitchenFields.latitude.optional(),
    longitude: kitchenFields.longitude.optional(),
    altitudeM: kitchenFields.altitudeM.optional(),
    timeZone: kitchenFields.timeZone.optional(),
    locale: kitchenFields.locale.optional(),
    /** Monthly clear-sky index of the clear-sky fallback, January … December; null restores the defaults. */
    clearness: clearnessSchema.nullable().optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one field to change.' })
  .meta({ minProperties: 1 }); // the refinement, as the OpenAPI document can say it
