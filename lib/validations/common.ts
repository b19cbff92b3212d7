import { z } from 'zod';
import { LOCALES, ROLES, TEMPERATURE_UNITS } from '@/entities/constants';

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
  .max(200, 'Use at most 200 characters.')
  // bcrypt reads only the first 72 bytes; a longer password would let its tail be anything.
  .refine((p) => new TextEncoder().encode(p).length <= 72, { message: 'Use at most 72 bytes (about 72 plain letters, fewer with accents or other scripts).', params: { i18n: 'passwordBytes' } });
/**
 * Control characters (PostgreSQL refuses NUL in text, and none belongs in a name) and unpaired
 * UTF-16 surrogates (not encodable in UTF-8: the database would silently store U+FFFD instead).
 * Format characters such as the zero-width joiner of emoji sequences or Arabic marks stay allowed.
 */
const CONTROL_OR_LONE_SURROGATE = /[\p{Cc}\p{Cs}]/u;

/** A name a person typed (of a person, a kitchen, …): 1–200 characters, trimmed, printable. */
export const displayName = () =>
  z
    .string({ message: 'Enter a name.' })
    .trim()
    .min(1, 'Enter a name.')
    .max(200, 'At most 200 characters.')
    .refine((s) => !CONTROL_OR_LONE_SURROGATE.test(s), { message: 'Remove the control characters (e.g. tabs or line breaks) and broken characters from the name.', params: { i18n: 'nameCharacters' } });
export const personName = displayName();
export const role = z.enum(ROLES, { message: `Role must be one of: ${ROLES.join(', ')}.` });
export const locale = z.enum(LOCALES, { message: `Language must be one of: ${LOCALES.join(', ')}.` });
export const temperatureUnit = z.enum(TEMPERATURE_UNITS, { message: 'Temperature unit must be C or F.' });
export const token = z.string({ message: 'The link is incomplete.' }).regex(/^[A-Za-z0-9_-]{20,100}$/, 'The link is not valid.');
