import type { MigrationObject } from '@mikro-orm/core';
import { Migration20261202002824 } from '../migrations/Migration20261202002824';
import { Migration20261202003926 } from '../migrations/Migration20261202003926';
import { Migration20261202004802 } from '../migrations/Migration20261202004802';
import { Migration20261202004846 } from '../migrations/Migration20261202004846';
import { Migration20261202010920 } from '../migrations/Migration20261202010920';
import { Migration20261202023345 } from '../migrations/Migration20261202023345';
import { Migration20261202024000 } from '../migrations/Migration20261202024000';
import { Migration20261204213000 } from '../migrations/Migration20261204213000';

/**
 * Migrations applied from code (start script, tests). Listed explicitly so they run without a
 * TypeScript loader; add each new migration here (kept outside migrations/ so the CLI does not
 * take this file for one).
 */
export const migrationsList: MigrationObject[] = [
  { name: 'Migration20261202002824', class: Migration20261202002824 },
  { name: 'Migration20261202003926', class: Migration20261202003926 },
  { name: 'Migration20261202004802', class: Migration20261202004802 },
  { name: 'Migration20261202004846', class: Migration20261202004846 },
  { name: 'Migration20261202010920', class: Migration20261202010920 },
  { name: 'Migration20261202023345', class: Migration20261202023345 },
  { name: 'Migration20261202024000', class: Migration20261202024000 },
  { name: 'Migration20261204213000', class: Migration20261204213000 },
];
