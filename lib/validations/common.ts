import { z } from 'zod';
import { LOCALES, ROLES, TEMPERATURE_UNITS } from '@/entities/base';

export const uuid = z.uuid({ message: 'Must be an id (UUID).' });
export const email = z
  .string({ message: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .max(320, 'E-mail addresses are at most 320 characters.')
  .pipe(z.email({ message: 'Enter a valid e-mail address, e.g. name@example.org.' }));
export const password = z
  .string({ message: 'Enter a password.' })
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.');
export const personName = z.string({ message: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(200, 'At most 200 characters.');
export const role = z.enum(ROLES, { message: `Role must be one of: ${ROLES.join(', ')}.` });
export const locale = z.enum(LOCALES, { message: `Language must be one of: ${LOCALES.join(', ')}.` });
export const temperatureUnit = z.enum(TEMPERATURE_UNITS, { message: 'Temperature unit must be C or F.' });
export const token = z.string({ message: 'The link is incomplete.' }).regex(/^[A-Za-z0-9_-]{20,100}$/, 'The link is not valid.');
