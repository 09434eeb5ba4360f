/** What travels between client and server: REST payloads and socket events, with their zod schemas. */
import { z } from 'zod';

export const ROLE_NAMES = ['player', 'teacher', 'admin'] as const;
export type RoleName = (typeof ROLE_NAMES)[number];

export const LIMITS = {
  emailMax: 254,
  passwordMin: 8,
  passwordMax: 200,
  displayNameMax: 60,
} as const;

const email = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .max(LIMITS.emailMax, `An e-mail address has at most ${LIMITS.emailMax} characters.`)
  .pipe(z.email({ error: 'That does not look like an e-mail address (name@example.test).' }));

export const registerSchema = z.object({
  email,
  password: z
    .string({ error: 'Choose a password.' })
    .min(LIMITS.passwordMin, `Use at least ${LIMITS.passwordMin} characters for your password.`)
    .max(LIMITS.passwordMax, `A password has at most ${LIMITS.passwordMax} characters.`),
  displayName: z
    .string({ error: 'Tell us the name to show at the table.' })
    .trim()
    .min(1, 'Tell us the name to show at the table.')
    .max(LIMITS.displayNameMax, `A name has at most ${LIMITS.displayNameMax} characters.`),
});
export type RegisterInput = z.input<typeof registerSchema>;

export const loginSchema = z.object({
  email,
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(LIMITS.passwordMax, `A password has at most ${LIMITS.passwordMax} characters.`),
});
export type LoginInput = z.input<typeof loginSchema>;

export const roleChangeSchema = z.object({
  role: z.enum(ROLE_NAMES, { error: `A role is one of: ${ROLE_NAMES.join(', ')}.` }),
});

export interface UserDto {
  id: number;
  email: string;
  displayName: string;
  role: RoleName;
  createdAt: string;
}

export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}
