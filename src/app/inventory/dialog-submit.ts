import { signal, type WritableSignal } from '@angular/core';
import type { AbstractControl } from '@angular/forms';
import { errorMessage, fieldErrors } from './messages';

/**
 * The submit of an inventory dialog's form: an invalid form shows its errors instead, one
 * save runs at a time (busy disables the button), and a failure becomes the dialog's message.
 */
export class DialogSubmit {
  readonly busy = signal(false);
  readonly error = signal<string | null>(null);

  /** `describe` turns a failure into the message shown (the field errors first, say). */
  async run(form: AbstractControl, save: () => Promise<void>, describe: (error: unknown) => string = errorMessage): Promise<void> {
    if (form.invalid || this.busy()) {
      form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    try {
      await save();
    } catch (error) {
      this.error.set(describe(error));
    } finally {
      this.busy.set(false);
    }
  }
}

/** A `describe` for a dialog that shows the server's field errors beside their fields: the message says to look there. */
export function showFieldErrors<F extends string>(serverErrors: WritableSignal<Partial<Record<F, string>>>): (error: unknown) => string {
  return (error) => {
    const fields = fieldErrors(error) as Partial<Record<F, string>>;
    serverErrors.set(fields);
    return Object.keys(fields).length ? 'Check the fields marked below.' : errorMessage(error);
  };
}
