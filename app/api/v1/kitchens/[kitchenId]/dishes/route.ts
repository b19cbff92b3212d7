import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { createDish, listDishes } from '@/lib/dishes';
import { createDishSchema } from '@/lib/validations/dishes';

type P = { kitchenId: string };

/** The organisation's dish library, seen from one of its kitchens. */
export const GET = route<P>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json({ dishes: await listDishes(access.em, access.kitchen.organisation.id) });
});

export const POST = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const input = await parseJson(req, createDishSchema, 32 * 1024);
  return json(await createDish(access, access.kitchen.organisation.id, input), { status: 201 });
});
