import type { NextRequest } from 'next/server';
import { json, parseJson, parseQuery, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { roleCan } from '@/lib/auth/permissions';
import { solveDraft } from '@/lib/drafts';
import { describePlan, getPlansForDate } from '@/lib/plans/queries';
import { solvePlanSchema } from '@/lib/validations/plans';
import { dateQuery } from '@/lib/validations/menus';

type P = { kitchenId: string };

/** The day's draft (for those who plan) and published plan. */
export const GET = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  const q = parseQuery(req, dateQuery);
  const plans = await getPlansForDate(access, q.date);
  return json(roleCan(access.role, 'see-drafts') ? plans : { ...plans, draft: null });
});

/** Solves a new draft for a day from its menu, the cookers and the weather. */
export const POST = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const input = await parseJson(req, solvePlanSchema, 4 * 1024);
  return json(describePlan(await solveDraft({ em: access.em, kitchen: access.kitchen, actorId: access.user.id }, input.date, input.timeLimitS)), { status: 201 });
});
