import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { planningSettingsSchema } from '@/lib/validations/plans';
import { recordAudit } from '@/lib/audit';
import { STOVES } from '@/lib/fuel';

type P = { kitchenId: string };

/** Shift hours, turnaround, currency and backup stoves with their efficiency and local price. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json({ planning: access.kitchen.planning, stoves: Object.values(STOVES) });
});

export const PUT = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const input = await parseJson(req, planningSettingsSchema, 16 * 1024);
  access.kitchen.planning = input;
  recordAudit(access.em, { organisationId: access.kitchen.organisation.id, kitchenId: access.kitchen.id, actorId: access.user.id, action: 'kitchen.planning', entityType: 'Kitchen', entityId: access.kitchen.id, details: input });
  await access.em.flush();
  return json({ planning: access.kitchen.planning, stoves: Object.values(STOVES) });
});
