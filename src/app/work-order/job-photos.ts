import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { UPLOAD_CONTENT_TYPES, UPLOAD_MAX_BYTES, type AttachmentKind, type AttachmentView } from '../../../shared/api/work-orders';
import type { ApiError } from '../core/http/api-error.interceptor';
import { ZonedDatePipe } from '../fleet/zoned-date';
import { WorkOrderApi } from './work-order-api';
import { ATTACHMENT_KIND_LABELS, UPLOAD_KINDS } from './work-order-words';

interface Upload {
  key: number;
  name: string;
  kind: AttachmentKind;
  percent: number;
  error: string | null;
}

const MB = 1024 * 1024;

/** Why a file cannot go, before it is sent; the server checks again by content. */
export function uploadProblem(file: File): string | null {
  if (file.size > UPLOAD_MAX_BYTES) return `${file.name} is too large (${(file.size / MB).toFixed(1)} MB): a file may be at most ${UPLOAD_MAX_BYTES / MB} MB.`;
  if (file.size === 0) return `${file.name} is empty.`;
  if (file.type && !(UPLOAD_CONTENT_TYPES as readonly string[]).includes(file.type)) return `${file.name} is not a JPEG, PNG or WebP photo or a PDF.`;
  return null;
}

/** Photos before and after, the data plate and invoices: taken with the phone's camera or chosen from files, with progress. */
@Component({
  selector: 'cw-job-photos',
  imports: [FormsModule, MatButtonModule, MatCardModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, MatSelectModule, ZonedDatePipe],
  templateUrl: './job-photos.html',
  styleUrl: './job-photos.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class JobPhotos {
  private readonly api = inject(WorkOrderApi);

  readonly workOrderId = input.required<string>();
  readonly attachments = input.required<AttachmentView[]>();
  readonly timeZone = input<string | null>(null);
  readonly canUpload = input(false);
  /** A file was stored: the page reloads the job. */
  readonly uploaded = output<AttachmentView>();

  protected readonly kinds = UPLOAD_KINDS;
  protected readonly kindLabels = ATTACHMENT_KIND_LABELS;
  protected readonly maxMb = UPLOAD_MAX_BYTES / MB;
  protected kind: AttachmentKind = 'before';
  protected readonly uploads = signal<Upload[]>([]);
  private nextKey = 0;

  protected picked(input: HTMLInputElement): void {
    const files = Array.from(input.files ?? []);
    input.value = ''; // the same photo can be picked again after an error
    // A PDF is a document, not a photo of the appliance: it goes in as an invoice unless "other" was picked.
    for (const file of files) this.send(file, file.type === 'application/pdf' && this.kind !== 'photo' ? 'invoice' : this.kind);
  }

  protected dismiss(key: number): void {
    this.uploads.update((list) => list.filter((upload) => upload.key !== key));
  }

  protected isImage(attachment: AttachmentView): boolean {
    return attachment.contentType.startsWith('image/');
  }

  private send(file: File, kind: AttachmentKind): void {
    const key = this.nextKey++;
    const problem = uploadProblem(file);
    this.uploads.update((list) => [...list, { key, name: file.name, kind, percent: 0, error: problem }]);
    if (problem) return;
    this.api.upload(this.workOrderId(), file, kind).subscribe({
      next: (progress) => {
        if (progress.kind === 'progress') this.patch(key, { percent: progress.percent });
        else {
          this.dismiss(key);
          this.uploaded.emit(progress.attachment);
        }
      },
      error: (error: ApiError) => this.patch(key, { error: `${file.name} was not saved: ${error.message}` }),
    });
  }

  private patch(key: number, change: Partial<Upload>): void {
    this.uploads.update((list) => list.map((upload) => (upload.key === key ? { ...upload, ...change } : upload)));
  }
}
