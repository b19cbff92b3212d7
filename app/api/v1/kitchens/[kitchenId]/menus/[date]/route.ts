import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { describeLine, getMenuLines, putMenu } from '@/lib/menus';
import { parsePathDate, putMenuSchema } from '@/lib/validations/menus';

type P = { kitchenId: string; date: string };

export const GET = route<P>(async (_req, { params }) => {
  const { kitchenId, date } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  const d = parsePathDate(date);
  return json({ date: d, lines: (await getMenuLines(access.em, access.kitchen.id, d)).map(describeLine) });
});

/** Replaces the day's menu (the whole list, in order). */
export const PUT = route<P>(async (req: NextRequest, { params }) => {
  const { kitchenId, date } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  const d = parsePathDate(date);
  const input = await parseJson(req, putMenuSchema, 64 * 1024);
  return json({ date: d, lines: await putMenu(access, d, input.lines) });
});
