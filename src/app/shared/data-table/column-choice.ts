import { computed, signal } from '@angular/core';

/**
 * Which columns a table shows, remembered in localStorage under the table's key. At least
 * one column stays shown; ids no longer known (a column removed in an update) are dropped.
 */
export class ColumnChoice {
  private readonly shown = signal<readonly string[]>([]);
  readonly visible = computed(() => this.all.filter((column) => this.shown().includes(column.id)).map((column) => column.id));

  constructor(
    readonly storageKey: string,
    readonly all: readonly { id: string; label: string }[],
    defaults: readonly string[] = all.map((column) => column.id),
    private readonly storage: Storage | null = typeof localStorage === 'undefined' ? null : localStorage,
  ) {
    this.shown.set(this.restore() ?? defaults);
  }

  isShown(id: string): boolean {
    return this.shown().includes(id);
  }

  toggle(id: string): void {
    const next = this.isShown(id) ? this.shown().filter((shown) => shown !== id) : [...this.shown(), id];
    if (!next.length) return;
    this.shown.set(next);
    try {
      this.storage?.setItem(this.storageKey, JSON.stringify(next));
    } catch {
      // Storage full or refused (private mode): the choice lasts for this visit only.
    }
  }

  private restore(): string[] | null {
    try {
      const saved: unknown = JSON.parse(this.storage?.getItem(this.storageKey) ?? 'null');
      if (!Array.isArray(saved)) return null;
      const known = saved.filter((id): id is string => typeof id === 'string' && this.all.some((column) => column.id === id));
      return known.length ? known : null;
    } catch {
      return null;
    }
  }
}
