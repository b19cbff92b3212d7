import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base, type Locale, type TemperatureUnit } from './base';

export interface User extends Base<'sessionVersion'> {
  /** Stored lower-case; unique. */
  email: string;
  /** bcrypt hash; null until an invited user sets a password. */
  passwordHash: string | null;
  name: string;
  locale: Locale;
  temperatureUnit: TemperatureUnit;
  /** Bumped when the password changes: sessions sealed with an older value are signed out. */
  sessionVersion: number;
}

export const UserSchema = new EntitySchema<User>({
  name: 'User',
  tableName: 'users',
  properties: {
    ...baseProperties,
    email: { type: 'string', length: 320, unique: true },
    passwordHash: { type: 'string', length: 100, nullable: true, hidden: true },
    name: { type: 'string', length: 200 },
    locale: { type: 'string', length: 8, default: 'en' },
    temperatureUnit: { type: 'string', length: 1, default: 'C' },
    sessionVersion: { type: 'integer', default: 0 },
  },
});
