import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { createCooker, listCookers } from '@/lib/cookers';
import { createCookerSchema } from '@/lib/validations/cookers';

type P = { kitchenId: string };

export const GET = route<P>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json({ cookers: await listCookers(access) });
});

export const POST = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'plan');
  const input = await parseJson(req, createCookerSchema, 64 * 1024);
  return json(await createCooker(access, input), { status: 201 });
});
