/** Checks of the report form, the same rules the server's TenantReportSchema applies. */
import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { UPLOAD_MAX_BYTES } from '../../../shared/api/work-orders';
import { TENANT_PHOTO_LIMIT } from '../../../shared/api/tenant';

/** The photo types the server keeps (its upload list without PDF: a tenant sends pictures). */
export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;

/** At least one symptom box ticked. */
export const someTicked: ValidatorFn = (group: AbstractControl): ValidationErrors | null =>
  Object.values((group.value ?? {}) as Record<string, boolean>).some(Boolean) ? null : { noneTicked: true };

/** "Something else" needs words: the description is required once that box is ticked. */
export const describedWhenOther: ValidatorFn = (control: AbstractControl): ValidationErrors | null => {
  const other = control.parent?.get('symptoms.other')?.value === true;
  return other && !String(control.value ?? '').trim() ? { describeOther: true } : null;
};

/** An access window: both ends given, the end after the start. */
export const windowInOrder: ValidatorFn = (group: AbstractControl): ValidationErrors | null => {
  const { from, to } = (group.value ?? {}) as { from?: string; to?: string };
  if (!from || !to) return null; // the required checks of the two fields speak
  return Date.parse(to) > Date.parse(from) ? null : { endsBeforeStart: true };
};

export interface PhotoPick {
  kept: File[];
  /** Why a file was left out, or null. */
  problem: string | null;
}

/** Adds picked files to those already chosen, leaving out the wrong type, too large or past the limit. */
export function pickPhotos(already: readonly File[], picked: readonly File[]): PhotoPick {
  const kept = [...already];
  const problems: string[] = [];
  for (const file of picked) {
    if (!(PHOTO_TYPES as readonly string[]).includes(file.type)) problems.push(`${file.name} (not a JPEG, PNG or WebP picture)`);
    else if (file.size > UPLOAD_MAX_BYTES) problems.push(`${file.name} (larger than ${UPLOAD_MAX_BYTES / (1024 * 1024)} MB)`);
    else if (kept.length >= TENANT_PHOTO_LIMIT) problems.push(`${file.name} (at most ${TENANT_PHOTO_LIMIT} photos fit in one report)`);
    else kept.push(file);
  }
  return { kept, problem: problems.length ? `Not added: ${problems.join('; ')}.` : null };
}

/** A datetime-local value ("2026-03-02T09:30", the browser's own clock) as an ISO instant. */
export function localToIso(local: string): string {
  return new Date(local).toISOString();
}
