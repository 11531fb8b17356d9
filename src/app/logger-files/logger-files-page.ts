import { DatePipe, DecimalPipe } from '@angular/common';
import { AfterViewInit, ChangeDetectionStrategy, Component, DestroyRef, computed, inject, signal, viewChild } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { EMPTY, firstValueFrom } from 'rxjs';
import { LOGGER_FILE_MAX_BYTES, type LoggerFileSummaryView } from '../../../shared/api/logger-files';
import type { ApplianceStyle, Health } from '../../../shared/domain';
import { STYLE_CHOICES, STYLE_LABELS } from '../inventory/labels';
import { errorMessage } from '../inventory/messages';
import { PagedTable } from '../inventory/paged-table';
import { EmptyState } from '../shared/empty-state/empty-state';
import { LoggerFilesApi } from './logger-files-api';
import { HEALTH_LABELS } from './logger-words';

/** Upload a logger CSV to analyse it; the files analysed before, newest first. */
@Component({
  selector: 'cw-logger-files-page',
  imports: [DatePipe, DecimalPipe, EmptyState, MatButtonModule, MatFormFieldModule, MatIconModule, MatPaginatorModule, MatProgressBarModule, MatSelectModule, MatSortModule, MatTableModule, ReactiveFormsModule, RouterLink],
  templateUrl: './logger-files-page.html',
  styleUrls: ['../inventory/list.scss', './logger-files-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoggerFilesPage implements AfterViewInit {
  private readonly api = inject(LoggerFilesApi);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  readonly sort = viewChild.required(MatSort);
  readonly paginator = viewChild.required(MatPaginator);

  protected readonly styles = STYLE_CHOICES;
  protected readonly maxMegabytes = LOGGER_FILE_MAX_BYTES / (1024 * 1024);
  protected readonly style = new FormControl<ApplianceStyle | ''>('', { nonNullable: true });
  protected readonly uploading = signal<string | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly table = new PagedTable<LoggerFileSummaryView>();
  protected readonly columns = ['fileName', 'period', 'findings', 'attached'];
  protected readonly nothingYet = computed(() => this.table.loaded() && this.table.total() === 0);
  protected readonly styleLabel = (style: ApplianceStyle) => STYLE_LABELS[style];
  protected readonly healthLabel = (health: Health) => HEALTH_LABELS[health] ?? health;

  ngAfterViewInit(): void {
    this.table.connect({
      sort: this.sort(),
      paginator: this.paginator(),
      filters: EMPTY,
      query: (_sort, paginator) => ({ page: paginator.pageIndex, pageSize: paginator.pageSize }),
      fetch: (query) => this.api.list(query),
      destroyRef: this.destroyRef,
    });
  }

  protected async choose(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.error.set(null);
    if (file.size > LOGGER_FILE_MAX_BYTES) {
      this.error.set(`${file.name} is larger than the ${this.maxMegabytes} MB limit.`);
      return;
    }
    this.uploading.set(file.name);
    try {
      const analysed = await firstValueFrom(this.api.upload(file, this.style.value || null));
      await this.router.navigate(['/logger-files', analysed.id]);
    } catch (error) {
      this.error.set(errorMessage(error));
    } finally {
      this.uploading.set(null);
    }
  }
}
