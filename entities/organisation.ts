import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';

export interface Organisation extends Base {
  name: string;
}

export const OrganisationSchema = new EntitySchema<Organisation>({
  name: 'Organisation',
  tableName: 'organisations',
  properties: {
    ...baseProperties,
    name: { type: 'string', length: 200 },
  },
});
