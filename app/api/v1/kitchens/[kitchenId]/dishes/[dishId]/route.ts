import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { archiveDish, describeDish, getDish, updateDish } from '@/lib/dishes';
import { updateDishSchema } from '@/lib/validations/dishes';

type P = { kitchenId: string; dishId: string };

export const GET = route<P>(async (_req, { params }) => {
  const { kitchenId, dishId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  return json(describeDish(await getDish(access.em, access.kitchen.organisation.id, dishId)));
});

export const PATCH = route<P>(async (req: NextRequest, { params }) => {
  const { kitchenId, dishId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  const input = await parseJson(req, updateDishSchema, 32 * 1024);
  return json(await updateDish(access, access.kitchen.organisation.id, dishId, input));
});

export const DELETE = route<P>(async (_req, { params }) => {
  const { kitchenId, dishId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  await archiveDish(access, access.kitchen.organisation.id, dishId);
  return new Response(null, { status: 204 });
});
