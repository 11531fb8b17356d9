import type { HarnessLoader } from '@angular/cdk/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';

/** The text input inside the Material form field with this label. */
export async function inputLabelled(loader: HarnessLoader, label: string): Promise<MatInputHarness> {
  const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const control = await field.getControl(MatInputHarness);
  if (!control) throw new Error(`no input labelled ${label}`);
  return control;
}

/** Lets promise chains started by a click or a flushed response run, then renders. */
export async function settle(fixture: { whenStable(): Promise<unknown>; detectChanges(): void }): Promise<void> {
  for (let round = 0; round < 3; round++) await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
  fixture.detectChanges();
}
