import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { describePlan, getPlan } from '@/lib/plans';

export const GET = route<{ kitchenId: string; planId: string }>(async (_req, { params }) => {
  const { kitchenId, planId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  return json(describePlan(await getPlan(access, planId)));
});
