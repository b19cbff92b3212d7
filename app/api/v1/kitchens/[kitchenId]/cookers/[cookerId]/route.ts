import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { archiveCooker, describeCooker, getCooker, updateCooker } from '@/lib/cookers';
import { updateCookerSchema } from '@/lib/validations/cookers';

type P = { kitchenId: string; cookerId: string };

export const GET = route<P>(async (_req, { params }) => {
  const { kitchenId, cookerId } = await params;
  const access = await requireKitchen(kitchenId, 'read');
  return json(describeCooker(await getCooker(access, cookerId)));
});

export const PATCH = route<P>(async (req: NextRequest, { params }) => {
  const { kitchenId, cookerId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  const input = await parseJson(req, updateCookerSchema, 64 * 1024);
  return json(await updateCooker(access, cookerId, input));
});

/** Archives the cooker (kept for past plans; gone from lists and planning). */
export const DELETE = route<P>(async (_req, { params }) => {
  const { kitchenId, cookerId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  await archiveCooker(access, cookerId);
  return new Response(null, { status: 204 });
});
