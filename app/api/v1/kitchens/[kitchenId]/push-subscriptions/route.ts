import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { listOwnSubscriptions, saveSubscription } from '@/lib/push/subscriptions';
import { pushSubscriptionSchema } from '@/lib/validations/cooks';

type P = { kitchenId: string };

/** The caller's own push subscriptions for this kitchen. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json({ subscriptions: await listOwnSubscriptions(access) });
});

/** Saves a browser's push subscription (PushSubscription.toJSON()) for this kitchen's alerts; 201 new, 200 updated. */
export const POST = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  const input = await parseJson(req, pushSubscriptionSchema, 4 * 1024);
  const r = await saveSubscription(access, input);
  return json(r.subscription, { status: r.created ? 201 : 200 });
});
