import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { signInSchema } from '@/lib/validations/session';
import { getEm } from '@/lib/db';
import { signIn } from '@/lib/accounts';
import { getSession } from '@/lib/auth/session';
import { clientIp } from '@/lib/http/client-ip';

/** Sign in: sets the session cookie. */
export const POST = route(async (req: NextRequest) => {
  const input = await parseJson(req, signInSchema, 16 * 1024);
  const em = await getEm();
  const user = await signIn(em, input.email, input.password, clientIp(req));
  const session = await getSession();
  session.userId = user.id;
  session.v = user.sessionVersion;
  session.kitchenId = undefined;
  await session.save();
  return json({ user: { id: user.id, email: user.email, name: user.name, locale: user.locale, temperatureUnit: user.temperatureUnit } });
});

/** Sign out: clears the session cookie. Safe to call when signed out. */
export const DELETE = route(async () => {
  const session = await getSession();
  session.destroy();
  return new Response(null, { status: 204 });
});
