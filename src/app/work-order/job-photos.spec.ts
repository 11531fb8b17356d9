import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { HttpEventType } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { UPLOAD_MAX_BYTES, type AttachmentView } from '../../../shared/api/work-orders';
import { JobPhotos } from './job-photos';
import { configureJobSpec, settle } from './work-order-fixtures';

function attachment(extra: Partial<AttachmentView> = {}): AttachmentView {
  return {
    id: 'f1', kind: 'before', contentType: 'image/jpeg', sizeBytes: 2000, displayName: 'coil.jpg', url: '/api/attachments/f1', thumbnailUrl: '/api/attachments/f1/thumbnail', createdAt: '2026-03-03T18:00:00.000Z',
    ...extra,
  };
}

describe('JobPhotos', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureJobSpec('contractor')));
  afterEach(() => backend.verify());

  async function render(attachments: AttachmentView[] = [], canUpload = true) {
    const fixture = TestBed.createComponent(JobPhotos);
    fixture.componentRef.setInput('workOrderId', 'w1');
    fixture.componentRef.setInput('attachments', attachments);
    fixture.componentRef.setInput('canUpload', canUpload);
    fixture.componentRef.setInput('timeZone', 'America/Los_Angeles');
    const uploaded: AttachmentView[] = [];
    fixture.componentInstance.uploaded.subscribe((file) => uploaded.push(file));
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement, uploaded };
  }

  async function pick(fixture: Awaited<ReturnType<typeof render>>['fixture'], which: 'camera' | 'files', file: File) {
    const input = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>(`input[data-testid="${which}"]`)!;
    const transfer = new DataTransfer();
    transfer.items.add(file);
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
    await settle(fixture);
  }

  it('offers the phone camera and a file picker for photos and PDFs', async () => {
    const { element } = await render();
    const camera = element.querySelector<HTMLInputElement>('input[data-testid="camera"]')!;
    expect(camera.accept).toBe('image/*');
    expect(camera.getAttribute('capture')).toBe('environment');
    expect(element.querySelector<HTMLInputElement>('input[data-testid="files"]')!.accept).toContain('application/pdf');
  });

  it('uploads a photo of the chosen kind with progress, then hands it to the page', async () => {
    const { fixture, loader, element, uploaded } = await render();
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Data plate' });
    await pick(fixture, 'camera', new File([new Uint8Array(5000)], 'plate.jpg', { type: 'image/jpeg' }));
    const call = backend.expectOne((req) => req.url === '/api/work-orders/w1/attachments' && req.method === 'POST');
    const form = call.request.body as FormData;
    expect(form.get('kind')).toBe('data-plate');
    expect((form.get('file') as File).name).toBe('plate.jpg');
    call.event({ type: HttpEventType.UploadProgress, loaded: 2500, total: 5000 });
    await settle(fixture);
    expect(element.querySelector('.upload')!.textContent).toContain('plate.jpg (Data plate) · 50 %');
    const stored = attachment({ id: 'f2', kind: 'data-plate', displayName: 'plate.jpg' });
    call.flush(stored);
    await settle(fixture);
    expect(uploaded).toEqual([stored]);
    expect(element.querySelector('.upload')).toBeNull();
  });

  it('refuses a file that is too large or of the wrong type before sending it', async () => {
    const { fixture, element } = await render();
    await pick(fixture, 'files', new File([new Uint8Array(UPLOAD_MAX_BYTES + 1)], 'huge.jpg', { type: 'image/jpeg' }));
    await pick(fixture, 'files', new File(['x'], 'notes.docx', { type: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document' }));
    const alerts = Array.from(element.querySelectorAll('[role="alert"]')).map((a) => a.textContent!.trim());
    expect(alerts[0]).toContain('huge.jpg is too large (10.0 MB): a file may be at most 10 MB.');
    expect(alerts[1]).toContain('notes.docx is not a JPEG, PNG or WebP photo or a PDF.');
    backend.expectNone('/api/work-orders/w1/attachments');
  });

  it('shows why the server refused a file', async () => {
    const { fixture, element, uploaded } = await render();
    await pick(fixture, 'files', new File(['%PDF-fake'], 'invoice.pdf', { type: 'application/pdf' }));
    const call = backend.expectOne('/api/work-orders/w1/attachments');
    expect((call.request.body as FormData).get('kind')).toBe('invoice'); // a PDF picked while "Before the repair" was chosen
    call
      .flush({ error: 'only JPEG, PNG or WebP photos and PDF documents can be uploaded' }, { status: 415, statusText: 'Unsupported Media Type' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('invoice.pdf was not saved: only JPEG, PNG or WebP photos and PDF documents can be uploaded');
    expect(uploaded).toEqual([]);
  });

  it('shows thumbnails of photos and an icon for PDFs, each opening the file', async () => {
    const { element } = await render([attachment(), attachment({ id: 'f3', kind: 'invoice', contentType: 'application/pdf', displayName: 'invoice.pdf', url: '/api/attachments/f3', thumbnailUrl: null })], false);
    expect(element.querySelector('input[type="file"]')).toBeNull();
    const links = Array.from(element.querySelectorAll<HTMLAnchorElement>('.gallery a'));
    expect(links.map((a) => a.getAttribute('href'))).toEqual(['/api/attachments/f1', '/api/attachments/f3']);
    expect(links[0]!.querySelector('img')!.getAttribute('src')).toBe('/api/attachments/f1/thumbnail');
    expect(links[0]!.querySelector('img')!.alt).toBe('Before the repair: coil.jpg');
    expect(links[1]!.textContent).toContain('picture_as_pdf');
    expect(element.querySelector('.gallery')!.textContent).toContain('Invoice');
  });
});
