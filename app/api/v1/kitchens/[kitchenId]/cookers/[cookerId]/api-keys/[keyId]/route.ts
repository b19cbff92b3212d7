import { route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { revokeApiKey } from '@/lib/cooks/api-keys';

/** Revokes a key (kept in the list, refused from now on). */
export const DELETE = route<{ kitchenId: string; cookerId: string; keyId: string }>(async (_req, { params }) => {
  const { kitchenId, cookerId, keyId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  await revokeApiKey(access, cookerId, keyId);
  return new Response(null, { status: 204 });
});
