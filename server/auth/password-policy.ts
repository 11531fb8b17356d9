import { badRequest } from '../errors';

/**
 * Checks beyond length (shared/api/auth.ts has those): NIST SP 800-63B §5.1.1.2 asks a
 * verifier to refuse commonly used passwords, repetitive or sequential characters, and
 * context-specific words such as the service's name or the user name. The list below is
 * short and from memory (common practice); it catches the obvious choices, not a breach corpus.
 */
const COMMON_PASSWORDS = new Set([
  'password1234', 'password12345', 'password123456', 'passwordpassword', '123456789012', '1234567890123',
  '12345678901234', 'qwertyuiop12', 'qwertyuiopas', 'qwerty123456', '1q2w3e4r5t6y', 'iloveyou1234',
  'letmein12345', 'welcome12345', 'administrator', 'changeme1234', 'abc123456789', 'aaaaaaaaaaaa',
  'monkey123456', 'football1234', 'baseball1234', 'sunshine1234', 'trustno1trustno1', 'princess1234',
]);

const CONTEXT_WORDS = ['chillwarden'];

function isSequential(password: string): boolean {
  const codes = [...password.toLowerCase()].map((char) => char.codePointAt(0) ?? 0);
  const step = codes[1] - codes[0];
  return Math.abs(step) === 1 && codes.every((code, index) => index === 0 || code - codes[index - 1] === step);
}

/** Throws 400 with a field message the form shows under the password. */
export function assertPasswordAcceptable(password: string, email: string, field = 'password'): void {
  const lower = password.toLowerCase();
  const localPart = email.split('@')[0]?.toLowerCase() ?? '';
  let problem: string | null = null;
  if (COMMON_PASSWORDS.has(lower)) problem = 'this password is too common; choose another';
  else if (isSequential(password)) problem = 'choose a password that is not a run of consecutive characters';
  else if (localPart.length >= 4 && lower.includes(localPart)) problem = 'choose a password that does not contain your e-mail address';
  else if (CONTEXT_WORDS.some((word) => lower.includes(word))) problem = 'choose a password that does not contain the name of this service';
  if (problem) throw badRequest('invalid input', [{ path: field, message: problem }]);
}
