import { json, route } from '@/lib/http/handler';
import { getEnv } from '@/lib/env';
import { notFound } from '@/lib/http/errors';
import { readPushDeliveries } from '@/lib/push/deliveries';

export const dynamic = 'force-dynamic';

/** Dev tools only: what the local push fake received. Off in production (404). */
export const GET = route(async () => {
  const env = getEnv();
  if (!env.devTools) throw notFound('Page');
  const list = await readPushDeliveries(env.PUSH_FAKE_DIR);
  return json({ deliveries: list.map(({ bodyBase64: _b, ...d }) => d) });
});
