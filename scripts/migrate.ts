/** Applies pending migrations to DATABASE_URL. Used by npm start, npm test and `npm run db:migrate`. */
import { MikroORM } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';

const orm = await MikroORM.init(config);
try {
  const applied = await orm.getMigrator().up();
  console.log(`[migrate] ${applied.length} migration(s) applied to ${new URL(config.clientUrl ?? '').pathname.slice(1)}`);
} finally {
  await orm.close(true);
}
