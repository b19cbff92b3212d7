import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { copyMenu } from '@/lib/menus';
import { copyMenuSchema, parsePathDate } from '@/lib/validations/menus';

/** Copies another day's menu onto this day (replacing it). */
export const POST = route<{ kitchenId: string; date: string }>(async (req: NextRequest, { params }) => {
  const { kitchenId, date } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  const d = parsePathDate(date);
  const input = await parseJson(req, copyMenuSchema, 4 * 1024);
  return json({ date: d, lines: await copyMenu(access, input.fromDate, d) });
});
