import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireKitchen } from '@/lib/auth/guard';
import { createApiKey, listApiKeys } from '@/lib/cooks/api-keys';
import { apiKeySchema } from '@/lib/validations/cooks';

type P = { kitchenId: string; cookerId: string };

/** The cooker's sensor keys (never the keys themselves). */
export const GET = route<P>(async (_req, { params }) => {
  const { kitchenId, cookerId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  return json({ keys: await listApiKeys(access, cookerId) });
});

/** Makes a key; the answer carries it once. */
export const POST = route<P>(async (req: NextRequest, { params }) => {
  const { kitchenId, cookerId } = await params;
  const access = await requireKitchen(kitchenId, 'plan');
  const input = await parseJson(req, apiKeySchema, 2 * 1024);
  return json(await createApiKey(access, cookerId, input.label), { status: 201, headers: { 'Cache-Control': 'no-store' } });
});
