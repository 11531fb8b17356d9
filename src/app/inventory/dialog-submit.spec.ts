import { signal } from '@angular/core';
import { FormControl, Validators } from '@angular/forms';
import { ApiError } from '../core/http/api-error.interceptor';
import { DialogSubmit, showFieldErrors } from './dialog-submit';

describe('DialogSubmit', () => {
  const validForm = () => new FormControl('Linden Court', { nonNullable: true, validators: [Validators.required] });

  it('shows an invalid form its errors and does not save', async () => {
    const submit = new DialogSubmit();
    const form = new FormControl('', { nonNullable: true, validators: [Validators.required] });
    const save = jasmine.createSpy('save').and.resolveTo();
    await submit.run(form, save);
    expect(save).not.toHaveBeenCalled();
    expect(form.touched).toBeTrue();
    expect(submit.busy()).toBeFalse();
  });

  it('is busy while saving, then clears the earlier error', async () => {
    const submit = new DialogSubmit();
    submit.error.set('an earlier failure');
    const busyDuringSave: boolean[] = [];
    await submit.run(validForm(), async () => {
      busyDuringSave.push(submit.busy());
    });
    expect(busyDuringSave).toEqual([true]);
    expect(submit.busy()).toBeFalse();
    expect(submit.error()).toBeNull();
  });

  it('runs one save at a time', async () => {
    const submit = new DialogSubmit();
    let finish!: () => void;
    const save = jasmine.createSpy('save').and.callFake(() => new Promise<void>((resolve) => (finish = resolve)));
    const first = submit.run(validForm(), save);
    await submit.run(validForm(), save);
    expect(save).toHaveBeenCalledTimes(1);
    finish();
    await first;
    expect(submit.busy()).toBeFalse();
  });

  it('turns a failure into the message describe gives', async () => {
    const submit = new DialogSubmit();
    await submit.run(
      validForm(),
      () => Promise.reject(new Error('409')),
      (error) => `Not saved: ${(error as Error).message}`,
    );
    expect(submit.error()).toBe('Not saved: 409');
    expect(submit.busy()).toBeFalse();
  });

  it('puts the server\'s field errors beside their fields and says to look there', () => {
    const serverErrors = signal<Partial<Record<'name', string>>>({});
    const error = new ApiError(409, 'Not saved', [{ path: 'name', message: 'that name is taken' }]);
    expect(showFieldErrors(serverErrors)(error)).toBe('Check the fields marked below.');
    expect(serverErrors()).toEqual({ name: 'That name is taken' });
  });

  it('says the failure itself when the server names no field, and clears the fields\' errors', () => {
    const serverErrors = signal<Partial<Record<'name', string>>>({ name: 'stale' });
    expect(showFieldErrors(serverErrors)(new ApiError(503, 'The server is busy.'))).toBe('The server is busy.');
    expect(serverErrors()).toEqual({});
  });
});
