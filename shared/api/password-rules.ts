/**
 * The length rules for a new password, without zod so the web client can use them as is.
 * After OWASP ASVS 4.0.3 V2.1.1 (at least 12 characters), V2.1.2 (64 allowed) and V2.1.9
 * (no composition rules). bcrypt reads only the first 72 bytes, so longer input is refused
 * rather than silently cut. The server adds checks against common and context words.
 */
export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 64;
export const PASSWORD_MAX_BYTES = 72;

/** What is wrong with a new password, as a form shows it; null when it passes. */
export function passwordLengthProblem(password: string): string | null {
  if (password.length < PASSWORD_MIN_LENGTH) return `use at least ${PASSWORD_MIN_LENGTH} characters`;
  if (password.length > PASSWORD_MAX_LENGTH) return `use at most ${PASSWORD_MAX_LENGTH} characters`;
  if (new TextEncoder().encode(password).length > PASSWORD_MAX_BYTES) return `use at most ${PASSWORD_MAX_BYTES} bytes (fewer accented or non-Latin characters)`;
  if (new Set(password).size <= 2) return 'choose a password that is not one repeated character';
  return null;
}
