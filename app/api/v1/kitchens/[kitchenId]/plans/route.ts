import type { NextRequest } from 'next/server';
import { json, parseJson, parseQuery, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { getPlansForDate, solveDraft } from '@/lib/plans';
import { solvePlanSchema } from '@/lib/validations/plans';
import { dateQuery } from '@/lib/validations/menus';

type P = { kitchenId: string };

/** The day's draft and published plan. */
export const GET = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  const q = parseQuery(req, dateQuery);
  return json(await getPlansForDate(access, q.date));
});

/** Solves a new draft for a day from its menu, the cookers and the weather. */
export const POST = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const input = await parseJson(req, solvePlanSchema, 4 * 1024);
  return json(await solveDraft(access, input.date, input.timeLimitS), { status: 201 });
});
