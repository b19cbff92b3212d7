import { defineConfig } from '@mikro-orm/postgresql';
import { Migrator } from '@mikro-orm/migrations';
import { allEntities } from './entities';
import { migrationsList } from './lib/migrations-list';

/** One configuration for the app, the worker, the tests and the CLI. */
export default defineConfig({
  clientUrl: process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/hearthcast',
  entities: allEntities,
  extensions: [Migrator],
  migrations: {
    path: './migrations',
    pathTs: './migrations',
    migrationsList,
    transactional: true,
    allOrNothing: true,
    snapshot: false,
  },
  pool: { min: 0, max: 10 },
  debug: false,
  allowGlobalContext: false,
});
