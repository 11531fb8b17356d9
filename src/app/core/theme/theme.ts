import { DOCUMENT } from '@angular/common';
import { Injectable, inject, signal } from '@angular/core';

export type ColorScheme = 'light' | 'dark';

const STORAGE_KEY = 'cw-color-scheme';

/** Light or dark, remembered per browser; the first visit follows the system setting. */
@Injectable({ providedIn: 'root' })
export class ThemeService {
  private readonly document = inject(DOCUMENT);
  private readonly current = signal<ColorScheme>('light');
  readonly scheme = this.current.asReadonly();

  apply(): void {
    this.set(this.stored() ?? this.systemPreference());
  }

  toggle(): void {
    const next: ColorScheme = this.current() === 'dark' ? 'light' : 'dark';
    this.set(next);
    this.document.defaultView?.localStorage.setItem(STORAGE_KEY, next);
  }

  private set(scheme: ColorScheme): void {
    this.current.set(scheme);
    this.document.documentElement.classList.toggle('cw-dark', scheme === 'dark');
  }

  private stored(): ColorScheme | null {
    const value = this.document.defaultView?.localStorage.getItem(STORAGE_KEY);
    return value === 'dark' || value === 'light' ? value : null;
  }

  private systemPreference(): ColorScheme {
    return this.document.defaultView?.matchMedia?.('(prefers-color-scheme: dark)').matches ? 'dark' : 'light';
  }
}
