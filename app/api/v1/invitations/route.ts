import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireViewer } from '@/lib/auth/guard';
import { createInvitation } from '@/lib/accounts';
import { createInvitationSchema } from '@/lib/validations/users';

/** A coordinator or kitchen lead invites someone by e-mail; the link goes by mail only. */
export const POST = route(async (req: NextRequest) => {
  const viewer = await requireViewer();
  const input = await parseJson(req, createInvitationSchema, 16 * 1024);
  return json(await createInvitation(viewer, input), { status: 201 });
});
