/** Loads the demo scenario into DATABASE_URL. Refuses unless demo mode is on (HEARTHCAST_DEMO=1). */
import { MikroORM } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';
import { seedDemo, DEMO_ORG } from '../lib/demo/seed';

if (process.env.HEARTHCAST_DEMO !== '1') {
  console.error('[seed] demo data loads only in demo mode: set HEARTHCAST_DEMO=1 (npm start does by default).');
  process.exit(1);
}
const orm = await MikroORM.init(config);
try {
  const r = await seedDemo(orm.em.fork());
  console.log(`[seed] ${r.created ? 'loaded' : 'already present:'} ${DEMO_ORG} (${Object.keys(r.kitchens).length} kitchens)`);
} finally {
  await orm.close(true);
}
