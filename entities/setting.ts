import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';

/** A value the app makes for itself and keeps (e.g. the VAPID key pair of push alerts). */
export interface Setting extends Base {
  key: string;
  value: unknown;
}

export const SettingSchema = new EntitySchema<Setting>({
  name: 'Setting',
  tableName: 'settings',
  properties: {
    ...baseProperties,
    key: { type: 'string', length: 64, unique: true },
    value: { type: 'json', hidden: true },
  },
});
