import { HttpClient, type HttpParams } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatSnackBar, MatSnackBarModule } from '@angular/material/snack-bar';
import { firstValueFrom } from 'rxjs';
import { ApiError } from '../../core/http/api-error.interceptor';
import { capitalise, errorMessage } from '../../inventory/messages';
import { SAVE_FILE, blobErrorMessage, fileNameOf } from './csv-download';

/** Downloads the table's filtered rows (every page) in the shown columns as CSV. */
@Component({
  selector: 'cw-export-button',
  imports: [MatButtonModule, MatIconModule, MatProgressSpinnerModule, MatSnackBarModule],
  template: `
    <button mat-stroked-button type="button" (click)="download()" [disabled]="busy()" [attr.aria-busy]="busy()">
      @if (busy()) {
        <mat-progress-spinner mode="indeterminate" diameter="18" aria-hidden="true" />
      } @else {
        <mat-icon aria-hidden="true">download</mat-icon>
      }
      Export CSV
    </button>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExportButton {
  private readonly http = inject(HttpClient);
  private readonly snackBar = inject(MatSnackBar);
  private readonly save = inject(SAVE_FILE);

  /** The export's path, e.g. /api/incidents/export. */
  readonly path = input.required<string>();
  readonly params = input.required<() => HttpParams>();
  readonly columns = input.required<readonly string[]>();
  /** Names the file when the server gives no name. */
  readonly fileName = input('export.csv');
  protected readonly busy = signal(false);

  async download(): Promise<void> {
    this.busy.set(true);
    try {
      const params = this.params()().set('columns', this.columns().join(','));
      const res = await firstValueFrom(this.http.get(this.path(), { params, responseType: 'blob', observe: 'response' }));
      if (res.body) this.save(res.body, fileNameOf(res.headers.get('Content-Disposition'), this.fileName()));
    } catch (error) {
      const fromServer = error instanceof ApiError ? await blobErrorMessage(error.body) : null;
      this.snackBar.open(fromServer ? capitalise(fromServer) : errorMessage(error), 'Dismiss', { duration: 10_000 });
    } finally {
      this.busy.set(false);
    }
  }
}
