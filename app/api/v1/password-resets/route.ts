import { after, type NextRequest } from 'next/server';
import { json, parseJson, route } from '@/lib/http/handler';
import { requestPasswordReset } from '@/lib/accounts';
import { requestResetSchema } from '@/lib/validations/users';
import { getEm } from '@/lib/db';

/**
 * Always 202 with the same message, registered or not. The look-up, the token and the mail run
 * after the answer is sent: done before it, a registered address answered about ten times slower
 * than an unknown one (the SMTP round trip), which told anyone which addresses have an account.
 */
export const POST = route(async (req: NextRequest) => {
  const input = await parseJson(req, requestResetSchema, 16 * 1024);
  after(async () => {
    try {
      await requestPasswordReset(await getEm(), input.email);
    } catch (err) {
      console.error('[password-reset] could not start a reset', err);
    }
  });
  return json({ message: 'If this address has an account, a reset link is on its way.' }, { status: 202 });
});
