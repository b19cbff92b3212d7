import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireViewer } from '@/lib/auth/guard';
import { createKitchen, listKitchensForUser } from '@/lib/kitchens';
import { getSession } from '@/lib/auth/session';
import { unauthorized } from '@/lib/http/errors';
import { createKitchenSchema } from '@/lib/validations/kitchens';

/** The caller's kitchens (all of the organisation for a coordinator). */
export const GET = route(async () => {
  // The guard's rule in one query (this is the most requested route); see listKitchensForUser.
  const session = await getSession();
  if (!session.userId) throw unauthorized();
  const kitchens = await listKitchensForUser(session.userId, session.v ?? 0);
  if (!kitchens) throw unauthorized('Your session has ended; sign in again.');
  return json({ kitchens });
});

/** A coordinator adds a kitchen to the organisation. */
export const POST = route(async (req: NextRequest) => {
  const viewer = await requireViewer();
  const input = await parseJson(req, createKitchenSchema, 16 * 1024);
  return json(await createKitchen(viewer, input), { status: 201 });
});
