import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { publishPlan } from '@/lib/plans';

/** Publishes a draft as an immutable, numbered version. */
export const POST = route<{ kitchenId: string; planId: string }>(async (_req, { params }) => {
  const { kitchenId, planId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  return json(await publishPlan(access, planId));
});
