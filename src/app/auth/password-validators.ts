import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { passwordLengthProblem } from '../../../shared/api/password-rules';

/** The server's length rules for a new password (shared/api/password-rules.ts), as a form validator. */
export const newPasswordValidator: ValidatorFn = (control: AbstractControl): ValidationErrors | null => {
  const problem = passwordLengthProblem(String(control.value ?? ''));
  return problem ? { password: problem } : null;
};

/** On a group with `password` and `confirm`: both the same. */
export const matchingPasswordsValidator: ValidatorFn = (group: AbstractControl): ValidationErrors | null => {
  const password = group.get('password')?.value;
  const confirm = group.get('confirm')?.value;
  return confirm && password !== confirm ? { mismatch: 'the two passwords differ' } : null;
};

/** The message an ApiError or any thrown value carries, for a form's error line. */
export function messageOf(error: unknown): string {
  return error instanceof Error && error.message ? error.message : 'Something went wrong. Try again.';
}

/** Field messages the server sent back (400 with details), keyed by field. */
export function fieldMessagesOf(error: unknown): Record<string, string> {
  const details = (error as { details?: { path: string; message: string }[] } | null)?.details;
  return Object.fromEntries((Array.isArray(details) ? details : []).map((detail) => [detail.path, detail.message]));
}
