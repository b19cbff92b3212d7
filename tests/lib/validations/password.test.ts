import { describe, expect, it } from 'vitest';
import { password } from '@/lib/validations/common';

describe('password rule', () => {
  it('refuses passwords longer than the 72 bytes bcrypt reads (OpenBSD bcrypt(3): "only the first 72 characters are significant")', () => {
    expect(password.safeParse('a'.repeat(72)).success).toBe(true);
    expect(password.safeParse('a'.repeat(73)).success).toBe(false);
    // 36 two-byte letters are 72 bytes; one more is over.
    expect(password.safeParse('é'.repeat(36)).success).toBe(true);
    expect(password.safeParse('é'.repeat(37)).success).toBe(false);
    expect(password.safeParse('short').success).toBe(false);
  });
});
