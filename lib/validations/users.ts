import { z } from 'zod';
import { email, locale, password, personName, role, temperatureUnit, token, uuid } from './common';

export const updateMeSchema = z
  .strictObject({ name: personName.optional(), locale: locale.optional(), temperatureUnit: temperatureUnit.optional() })
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one of name, locale, temperatureUnit.' })
  .meta({ minProperties: 1 }); // the refinement, as the OpenAPI document can say it

export const createInvitationSchema = z
  .strictObject({
    email,
    role,
    kitchenId: uuid.nullable().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.role !== 'coordinator' && !v.kitchenId) {
      ctx.addIssue({ code: 'custom', path: ['kitchenId'], message: 'Choose the kitchen for a kitchen lead or cook.', params: { i18n: 'kitchenForRole' } });
    }
  });

export const acceptInvitationSchema = z.strictObject({ token, name: personName, password });
export const requestResetSchema = z.strictObject({ email });
export const confirmResetSchema = z.strictObject({ token, password });
