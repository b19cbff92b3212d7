import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { recordCheckIn } from '@/lib/cooks/check-ins';
import { checkInSchema } from '@/lib/validations/cooks';

/** A batch started, done or skipped; 201 the first time, 200 with the same answer when the idempotency key repeats. */
export const POST = route<{ kitchenId: string }>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'log-cooking');
  const input = await parseJson(req, checkInSchema, 4 * 1024);
  const r = await recordCheckIn(access, input);
  return json(r.body, { status: r.status });
});
