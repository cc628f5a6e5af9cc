// Mirrors shared/schemas/auth.ts passwordSchema, which decides; this is only the sentence shown beforehand.
export const PASSWORD_HINT = 'At least 10 characters, and not a common password.';
