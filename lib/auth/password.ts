import { hash, verify } from '@node-rs/bcrypt';

/** bcrypt cost factor; 10 or more (OWASP Password Storage Cheat Sheet recommends ≥ 10). */
export const BCRYPT_COST = 10;

export const hashPassword = (plain: string) => hash(plain, BCRYPT_COST);

/** A hash of a random string, compared when the account does not exist so timing does not reveal it. */
const DUMMY_HASH = '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.yYp5G0yPGmE7dI8B7CFdEIlTlm8K';

export async function verifyPassword(plain: string, passwordHash: string | null): Promise<boolean> {
  if (!passwordHash) {
    await verify(plain, DUMMY_HASH).catch(() => false);
    return false;
  }
  return verify(plain, passwordHash).catch(() => false);
}
