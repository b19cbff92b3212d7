import type { NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requestPasswordReset } from '@/lib/accounts';
import { requestResetSchema } from '@/lib/validations/users';
import { getEm } from '@/lib/db';

/** Always 202 with the same message, registered or not. */
export const POST = route(async (req: NextRequest) => {
  const input = await parseJson(req, requestResetSchema, 16 * 1024);
  await requestPasswordReset(await getEm(), input.email);
  return json({ message: 'If this address has an account, a reset link is on its way.' }, { status: 202 });
});
