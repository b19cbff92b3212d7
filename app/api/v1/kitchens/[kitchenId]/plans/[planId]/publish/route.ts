import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { publishDraft } from '@/lib/drafts';
import { describePlan } from '@/lib/plans/queries';

/** Publishes a draft as an immutable, numbered version. */
export const POST = route<{ kitchenId: string; planId: string }>(async (_req, { params }) => {
  const { kitchenId, planId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  return json(describePlan(await publishDraft({ em: access.em, kitchen: access.kitchen, actorId: access.user.id }, planId)));
});
