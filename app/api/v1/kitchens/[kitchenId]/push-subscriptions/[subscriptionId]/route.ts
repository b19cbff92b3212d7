import { route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { removeSubscription } from '@/lib/push/subscriptions';

/** Removes one of the caller's subscriptions (alerts off on that phone). */
export const DELETE = route<{ kitchenId: string; subscriptionId: string }>(async (_req, { params }) => {
  const { kitchenId, subscriptionId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  await removeSubscription(access, subscriptionId);
  return new Response(null, { status: 204 });
});
