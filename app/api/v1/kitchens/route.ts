import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireViewer } from '@/lib/auth/guard';
import { createKitchen, listKitchens } from '@/lib/kitchens';
import { createKitchenSchema } from '@/lib/validations/kitchens';

/** The caller's kitchens (all of the organisation for a coordinator). */
export const GET = route(async () => json({ kitchens: await listKitchens(await requireViewer()) }));

/** A coordinator adds a kitchen to the organisation. */
export const POST = route(async (req: NextRequest) => {
  const viewer = await requireViewer();
  const input = await parseJson(req, createKitchenSchema, 16 * 1024);
  return json(await createKitchen(viewer, input), { status: 201 });
});
