import { json, route } from '@/lib/http/handler';
import { getEnv } from '@/lib/env';
import { requireCoordinatorOrg, requireViewer } from '@/lib/auth/guard';
import { notFound } from '@/lib/http/errors';
import { readPushDeliveries } from '@/lib/push/deliveries';

export const dynamic = 'force-dynamic';

/** Dev tools only: what the local push fake received. Off in production (404); coordinators only. */
export const GET = route(async () => {
  const env = getEnv();
  if (!env.devTools) throw notFound('Page');
  // The fake's messages carry one-time links of every account: coordinators only, even in a demo.
  requireCoordinatorOrg(await requireViewer());
  const list = await readPushDeliveries(env.PUSH_FAKE_DIR);
  return json({ deliveries: list.map(({ bodyBase64: _b, ...d }) => d) });
});
