import { json, route } from '@/lib/http/handler';
import { getEm } from '@/lib/db';

export const dynamic = 'force-dynamic';

/** Liveness with a database round trip; no session needed, no data revealed. */
export const GET = route(async () => {
  const em = await getEm();
  await em.getConnection().execute('select 1');
  return json({ ok: true });
});
