import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { confirmPasswordReset } from '@/lib/accounts';
import { confirmResetSchema } from '@/lib/validations/users';
import { getEm } from '@/lib/db';

export const POST = route(async (req: NextRequest) => {
  const input = await parseJson(req, confirmResetSchema, 16 * 1024);
  await confirmPasswordReset(await getEm(), input);
  return json({ message: 'Your password is changed. Sign in with it now.' });
});
