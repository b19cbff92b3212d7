import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { notFound } from '@/lib/http/errors';
import { roleCan } from '@/lib/auth/permissions';
import { describePlan, getPlan } from '@/lib/plans/queries';

export const GET = route<{ kitchenId: string; planId: string }>(async (_req, { params }) => {
  const { kitchenId, planId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  const plan = await getPlan(access, planId);
  // Drafts are the lead's working copy: cooks see published plans only.
  if (plan.status === 'draft' && !roleCan(access.role, 'see-drafts')) throw notFound('Plan');
  return json(describePlan(plan));
});
