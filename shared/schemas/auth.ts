import { z } from 'zod';
import { SELF_CHOSEN_ROLES } from '../permissions';
import { COMMON_PASSWORDS } from './common-passwords';

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'That email address is too long')
  .pipe(z.email('Enter a valid email address'));

export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters')
  .refine((p) => !isCommonPassword(p), 'That password is too common; pick something less guessable');

export function isCommonPassword(password: string): boolean {
  const lower = password.toLowerCase();
  if (COMMON_PASSWORDS.has(lower)) return true;
  // One character repeated, or a plain run like 1234567890, is as weak as a listed one.
  if (/^(.)\1+$/.test(lower)) return true;
  return '01234567890123456789'.includes(lower) || 'abcdefghijklmnopqrstuvwxyz'.includes(lower);
}

export const displayNameSchema = z
  .string()
  .trim()
  .min(2, 'Use at least 2 characters')
  .max(60, 'Use at most 60 characters');

export const signupInputSchema = z.strictObject({
  email: emailSchema,
  password: passwordSchema,
  displayName: displayNameSchema,
  roles: z
    .array(z.enum(SELF_CHOSEN_ROLES, 'Pick songwriter, drummer or engineer'))
    .min(1, 'Pick at least one role')
    .max(3),
});
export type SignupInput = z.infer<typeof signupInputSchema>;

export const loginInputSchema = z.strictObject({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type LoginInput = z.infer<typeof loginInputSchema>;

export const tokenInputSchema = z.strictObject({ token: z.string().min(10).max(200) });

export const forgotPasswordInputSchema = z.strictObject({ email: emailSchema });
export type ForgotPasswordInput = z.infer<typeof forgotPasswordInputSchema>;

export const resetPasswordInputSchema = z.strictObject({
  token: z.string().min(10).max(200),
  password: passwordSchema,
});
export type ResetPasswordInput = z.infer<typeof resetPasswordInputSchema>;

export const changePasswordInputSchema = z.strictObject({
  currentPassword: z.string().min(1, 'Enter your current password').max(200),
  newPassword: passwordSchema,
});
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

export const updateAccountInputSchema = z.strictObject({
  displayName: displayNameSchema,
  roles: z.array(z.enum(SELF_CHOSEN_ROLES)).min(1, 'Keep at least one role').max(3),
  timeZone: z.string().min(1).max(64).refine(isTimeZone, 'Pick a time zone from the list'),
});
export type UpdateAccountInput = z.infer<typeof updateAccountInputSchema>;

export function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

export const meSchema = z.object({
  user: z
    .object({
      id: z.string(),
      email: z.string(),
      displayName: z.string(),
      roles: z.array(z.string()),
      emailVerified: z.boolean(),
      timeZone: z.string(),
    })
    .nullable(),
});
export type Me = z.infer<typeof meSchema>;
export type MeUser = NonNullable<Me['user']>;
