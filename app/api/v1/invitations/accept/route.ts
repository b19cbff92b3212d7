import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { acceptInvitation } from '@/lib/accounts';
import { acceptInvitationSchema } from '@/lib/validations/users';
import { getEm } from '@/lib/db';
import { getSession } from '@/lib/auth/session';
import { getRequestLocale } from '@/lib/i18n/config';

/** The invitee sets a name and password from the one-time link and is signed in. */
export const POST = route(async (req: NextRequest) => {
  const input = await parseJson(req, acceptInvitationSchema, 16 * 1024);
  const user = await acceptInvitation(await getEm(), input, await getRequestLocale());
  const session = await getSession();
  session.userId = user.id;
  session.v = user.sessionVersion;
  await session.save();
  return json({ user: { id: user.id, email: user.email, name: user.name } });
});
