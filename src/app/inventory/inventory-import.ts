import { ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { DecimalPipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, filter, firstValueFrom, map, of, switchMap, takeWhile, timer } from 'rxjs';
import { IMPORT_COLUMNS, IMPORT_MAX_BYTES, IMPORT_MAX_ROWS, type ImportAction, type ImportJob, type ImportPreview } from '../../../shared/api/inventory';
import type { ApplianceStyle } from '../../../shared/domain';
import { InventoryImportApi } from './inventory-import-api';
import { STYLE_LABELS, countOf, inventoryCounts } from './labels';
import { ListStatus } from './list-status';
import { capitalise, errorMessage } from './messages';

export const IMPORT_POLL_MS = 400;
/** A file with thousands of problems usually has a few kinds of them: the first hundred show which. */
export const ERRORS_SHOWN = 100;

const TEMPLATE_ROWS = [
  IMPORT_COLUMNS.join(','),
  'Cedar Row,1 Example Road,,Springfield,IL,62701,US,America/Chicago,1A,1,top-freezer,TF-18,SN-0001,2021-04-12,2022-04-12',
  'Cedar Row,,,,,,,,1B,1,bottom-freezer,BF-22,SN-0002,,',
];

const ACTION_WORDS: Record<ImportAction, string> = { create: 'new', existing: 'exists', none: '—' };

/**
 * The CSV import: the file is checked first (every row error shown, nothing written), then
 * imported all or nothing while a progress bar follows the server's progress.
 */
@Component({
  selector: 'cw-inventory-import',
  imports: [DecimalPipe, ListStatus, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, RouterLink],
  templateUrl: './inventory-import.html',
  styleUrls: ['./list.scss', './inventory-import.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InventoryImport {
  private readonly api = inject(InventoryImportApi);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly columns = IMPORT_COLUMNS;
  protected readonly maxRows = IMPORT_MAX_ROWS;
  protected readonly capitalise = capitalise;
  protected readonly counts = inventoryCounts;
  protected readonly countOf = countOf;
  protected readonly maxMegabytes = IMPORT_MAX_BYTES / (1024 * 1024);
  protected readonly styleLabel = (style: ApplianceStyle) => STYLE_LABELS[style];
  protected readonly actionWord = (action: ImportAction) => ACTION_WORDS[action];
  protected readonly errorColumns = ['line', 'column', 'message'];
  protected readonly sampleColumns = ['line', 'property', 'unit', 'appliance'];
  protected readonly templateHref = `data:text/csv;charset=utf-8,${encodeURIComponent(TEMPLATE_ROWS.join('\r\n') + '\r\n')}`;

  protected readonly file = signal<File | null>(null);
  protected readonly checking = signal(false);
  protected readonly preview = signal<ImportPreview | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly job = signal<ImportJob | null>(null);
  protected readonly shownErrors = computed(() => this.preview()?.errors.slice(0, ERRORS_SHOWN) ?? []);
  protected readonly hiddenErrors = computed(() => Math.max(0, (this.preview()?.errors.length ?? 0) - ERRORS_SHOWN));
  protected readonly percent = computed(() => {
    const job = this.job();
    if (!job) return 0;
    if (job.state === 'done') return 100;
    return job.total ? Math.round((job.processed / job.total) * 100) : 0;
  });
  protected readonly nothingToCreate = computed(() => {
    const create = this.preview()?.create;
    return !!create && create.properties + create.units + create.appliances === 0;
  });

  protected async choose(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0] ?? null;
    input.value = ''; // choosing the same file again after fixing it must fire again
    if (!file) return;
    this.file.set(file);
    this.preview.set(null);
    this.job.set(null);
    this.error.set(null);
    if (file.size > IMPORT_MAX_BYTES) {
      this.error.set(`${file.name} is larger than the ${this.maxMegabytes} MB limit. Split it into smaller files.`);
      return;
    }
    this.checking.set(true);
    try {
      this.preview.set(await firstValueFrom(this.api.preview(file)));
    } catch (error) {
      this.error.set(errorMessage(error));
    } finally {
      this.checking.set(false);
    }
  }

  protected async start(): Promise<void> {
    const file = this.file();
    if (!file || !this.preview()?.ok) return;
    this.error.set(null);
    try {
      const job = await firstValueFrom(this.api.start(file));
      this.job.set(job);
      this.follow(job.id);
    } catch (error) {
      this.error.set(errorMessage(error));
    }
  }

  protected reset(): void {
    this.file.set(null);
    this.preview.set(null);
    this.job.set(null);
    this.error.set(null);
  }

  /** Polls the import until it is done or failed; a failed poll is shown and retried on the next tick. */
  private follow(importId: string): void {
    timer(IMPORT_POLL_MS, IMPORT_POLL_MS)
      .pipe(
        switchMap(() =>
          this.api.status(importId).pipe(
            map((job) => ({ job, error: null as string | null })),
            catchError((error: unknown) => of({ job: null, error: errorMessage(error) })),
          ),
        ),
        filter(({ job, error }) => {
          if (error) this.error.set(`${error} Still trying…`);
          return job !== null;
        }),
        map(({ job }) => job as ImportJob),
        takeWhile((job) => job.state === 'running', true),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((job) => {
        this.error.set(null);
        this.job.set(job);
      });
  }
}
