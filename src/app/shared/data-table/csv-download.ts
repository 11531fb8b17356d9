import { InjectionToken } from '@angular/core';

/** Saves a downloaded file; specs replace it to see what would be saved. */
export const SAVE_FILE = new InjectionToken<(blob: Blob, fileName: string) => void>('save a file', {
  providedIn: 'root',
  factory: () => (blob: Blob, fileName: string) => {
    const url = URL.createObjectURL(blob);
    const link = document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.click();
    setTimeout(() => URL.revokeObjectURL(url), 0);
  },
});

/** The file name of a Content-Disposition header (RFC 6266), else the fallback. */
export function fileNameOf(contentDisposition: string | null, fallback: string): string {
  const match = /filename="?([^";]+)"?/i.exec(contentDisposition ?? '');
  return match ? match[1] : fallback;
}

/** The server's sentence from an error body that arrived as a Blob (a failed file download). */
export async function blobErrorMessage(body: unknown): Promise<string | null> {
  if (!(body instanceof Blob)) return null;
  try {
    const parsed = JSON.parse(await body.text()) as { error?: unknown };
    return typeof parsed.error === 'string' ? parsed.error : null;
  } catch {
    return null;
  }
}
