import { z } from 'zod';
import { email } from './common';

export const signInSchema = z.strictObject({
  email,
  password: z.string({ message: 'Enter your password.' }).min(1, 'Enter your password.').max(200, 'At most 200 characters.'),
});
export type SignInInput = z.infer<typeof signInSchema>;
