import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { removeSubscription } from '@/lib/push/subscriptions';

/** Removes one of the caller's subscriptions (alerts off for this kitchen on that phone); says whether another kitchen still uses the endpoint. */
export const DELETE = route<{ kitchenId: string; subscriptionId: string }>(async (_req, { params }) => {
  const { kitchenId, subscriptionId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  return json(await removeSubscription(access, subscriptionId));
});
