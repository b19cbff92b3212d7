/** Loads the demo scenario into DATABASE_URL. Refuses unless demo mode is on (HEARTHCAST_DEMO=1). */
import { MikroORM } from '@mikro-orm/postgresql';
import config from '../mikro-orm.config';
import { KitchenSchema } from '../entities';
import { seedDemo, seedDemoPlans, DEMO_ORG } from '../lib/demo/seed';
import { stopBossClient } from '../lib/queues/client';

if (process.env.HEARTHCAST_DEMO !== '1') {
  console.error('[seed] demo data loads only in demo mode: set HEARTHCAST_DEMO=1 (npm start does by default).');
  process.exit(1);
}
const orm = await MikroORM.init(config);
try {
  const r = await seedDemo(orm.em.fork());
  console.log(`[seed] ${r.created ? 'loaded' : 'already present:'} ${DEMO_ORG} (${Object.keys(r.kitchens).length} kitchens)`);
  const em = orm.em.fork();
  const kitchens = await em.find(KitchenSchema, { id: { $in: Object.values(r.kitchens).map((k) => k.id) } }, { populate: ['organisation'] });
  const bySlug = Object.fromEntries(Object.entries(r.kitchens).map(([slug, k]) => [slug, kitchens.find((x) => x.id === k.id)!]));
  const plans = await seedDemoPlans(em, bySlug);
  for (const p of plans) console.log(`[seed] planned ${p}`);
} finally {
  // Publishing today's plans scheduled their alerts through a pg-boss client; let the process end.
  await stopBossClient();
  await orm.close(true);
}
