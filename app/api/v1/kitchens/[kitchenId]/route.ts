import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { describeKitchen, updateKitchen } from '@/lib/kitchens';
import { updateKitchenSchema } from '@/lib/validations/kitchens';

type P = { kitchenId: string };

export const GET = route<P>(async (_req, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'read');
  return json(describeKitchen(access.kitchen, access.role));
});

export const PATCH = route<P>(async (req: NextRequest, { params }) => {
  const access = await requireKitchen((await params).kitchenId, 'manage-kitchen');
  const input = await parseJson(req, updateKitchenSchema, 16 * 1024);
  return json(await updateKitchen(access, input));
});
