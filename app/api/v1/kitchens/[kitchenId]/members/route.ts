import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { listKitchenMembers } from '@/lib/kitchens';

export const GET = route<{ kitchenId: string }>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json({ members: await listKitchenMembers(access) });
});
