import type { NextRequest } from 'next/server';
import { cookies } from 'next/headers';
import { json, parseJson, route } from '@/lib/http/handler';
import { requireViewer } from '@/lib/auth/guard';
import { describeViewer } from '@/lib/accounts';
import { updateMeSchema } from '@/lib/validations/users';
import { LOCALE_COOKIE } from '@/lib/i18n/config';

export const GET = route(async () => json(describeViewer(await requireViewer())));

/** Changes the caller's name, language or temperature unit. */
export const PATCH = route(async (req: NextRequest) => {
  const viewer = await requireViewer();
  const input = await parseJson(req, updateMeSchema, 16 * 1024);
  viewer.em.assign(viewer.user, input);
  await viewer.em.flush();
  if (input.locale) (await cookies()).set(LOCALE_COOKIE, input.locale, { path: '/', sameSite: 'lax', maxAge: 3600 * 24 * 365 });
  return json(describeViewer(viewer));
});
