import { json, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { getTodayPage } from '@/lib/cooks/today';

export const dynamic = 'force-dynamic';

/** Today's published plan (kitchen-local date) as cooks need it: slots per cooker with their state, re-predicted from the latest readings, with safety notes; and tomorrow's published plan. */
export const GET = route<{ kitchenId: string }>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json(await getTodayPage(access.em, access.kitchen, access.role), { headers: { 'Cache-Control': 'private, no-cache' } });
});
