/**
 * Uploads on a work order: the content decides the type (file-type's magic bytes), not
 * the name or the client's Content-Type; size is limited; a name that climbs folders is
 * refused; stored under a random key; streamed back only to those who see the job.
 */
import sharp from 'sharp';
import request from 'supertest';
import { UPLOAD_MAX_BYTES } from '../../shared/api/work-orders';
import type { Browser } from '../auth/support/browser';
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

async function jpeg(width = 64, height = 48): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: '#2a6f97' } }).jpeg().toBuffer();
}

function upload(browser: Browser, workOrderId: string, content: Buffer, filename: string, contentType: string, kind = 'before') {
  return browser.agent
    .post(`/api/work-orders/${workOrderId}/attachments`)
    .set('X-XSRF-TOKEN', browser.csrfToken)
    .field('kind', kind)
    .attach('file', content, { filename, contentType });
}

/**
 * A multipart body written by hand, so the file name goes over the wire exactly as given
 * (form-data, under supertest, would reduce it to its base name first).
 */
function rawUpload(browser: Browser, workOrderId: string, content: Buffer, filename: string) {
  const boundary = 'cw-spec-boundary-7d1f';
  const body = Buffer.concat([
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\nbefore\r\n`),
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${filename.replace(/"/g, '%22')}"\r\nContent-Type: image/jpeg\r\n\r\n`),
    content,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  return browser.agent
    .post(`/api/work-orders/${workOrderId}/attachments`)
    .set('X-XSRF-TOKEN', browser.csrfToken)
    .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
    .send(body);
}

describe('work-order uploads', () => {
  let world: WorkOrderWorld;
  let workOrderId: string;
  let technician: Browser;

  async function attachmentCount(): Promise<number> {
    const [row] = await world.db.dataSource.query(`SELECT count(*)::int AS n FROM attachment WHERE work_order_id = $1`, [workOrderId]);
    return row.n;
  }

  beforeAll(async () => {
    world = await createWorkOrderWorld();
    const device = await world.device(0);
    const manager = await world.signedIn(world.people.manager);
    const opened = await manager.post('/api/service-requests', { applianceId: device.applianceId, priority: 'routine', title: 'Door gasket torn' });
    workOrderId = (await manager.post(`/api/service-requests/${opened.body.id}/dispatch`, {})).body.workOrder.id;
    technician = await world.signedIn(world.people.primaryTech);
    expect((await technician.post(`/api/work-orders/${workOrderId}/accept`)).status).toBe(200);
  }, 30_000);
  afterAll(async () => world.close());

  it('stores a photo under a random key with a thumbnail, and streams it only to people who see the job', async () => {
    const photo = await jpeg();
    const res = await upload(technician, workOrderId, photo, 'data plate.jpg', 'image/jpeg', 'data-plate');
    expect(res.status).toBe(201);
    expect(res.body.contentType).toBe('image/jpeg');
    expect(res.body.kind).toBe('data-plate');
    expect(res.body.thumbnailUrl).toBe(`/api/attachments/${res.body.id}/thumbnail`);
    const [row] = await world.db.dataSource.query(`SELECT object_key, thumbnail_key, display_name FROM attachment WHERE id = $1`, [res.body.id]);
    expect(row.object_key).toMatch(new RegExp(`^${world.place.organizationId}/[0-9a-f-]{36}\\.jpg$`));
    expect(row.object_key).not.toContain('plate');
    expect(row.display_name).toBe('data plate.jpg');

    const manager = await world.signedIn(world.people.manager);
    const original = await manager.agent.get(res.body.url).buffer(true);
    expect(original.status).toBe(200);
    expect(original.headers['content-type']).toBe('image/jpeg');
    expect(original.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(original.body as Buffer, photo)).toBe(0);
    const thumbnail = await technician.agent.get(res.body.thumbnailUrl).buffer(true);
    expect(thumbnail.status).toBe(200);
    expect((await sharp(thumbnail.body as Buffer).metadata()).format).toBe('webp');

    for (const outsider of [world.people.idleTech, world.people.tenantA, world.people.outsider]) {
      const browser = await world.signedIn(outsider);
      expect((await browser.agent.get(res.body.url)).status).withContext(outsider.email).toBe(404);
    }
    expect((await request(world.app).get(res.body.url)).status).toBe(401);
  });

  it('takes the type from the content: a PNG named .pdf is a PNG', async () => {
    const png = await sharp({ create: { width: 20, height: 20, channels: 3, background: '#ffffff' } }).png().toBuffer();
    const res = await upload(technician, workOrderId, png, 'invoice.pdf', 'application/pdf', 'after');
    expect(res.status).toBe(201);
    expect(res.body.contentType).toBe('image/png');
  });

  it('refuses a PHP script renamed .jpg, whatever Content-Type it claims, and stores nothing', async () => {
    const before = await attachmentCount();
    const script = Buffer.from('<?php echo shell_exec($_GET["cmd"]); ?>\n');
    const res = await upload(technician, workOrderId, script, 'photo.jpg', 'image/jpeg');
    expect(res.status).toBe(415);
    expect(res.body.error).toContain('JPEG');
    expect(await attachmentCount()).toBe(before);
  });

  it('refuses a file over the size limit with 413', async () => {
    const before = await attachmentCount();
    const photo = await jpeg();
    const oversized = Buffer.concat([photo, Buffer.alloc(UPLOAD_MAX_BYTES + 1 - photo.length)]);
    const res = await upload(technician, workOrderId, oversized, 'huge.jpg', 'image/jpeg');
    expect(res.status).toBe(413);
    expect(await attachmentCount()).toBe(before);
  });

  it('accepts a plain name sent the same way (the refusals below are about the name)', async () => {
    expect((await rawUpload(technician, workOrderId, await jpeg(), 'gasket-before.jpg')).status).toBe(201);
  });

  it('refuses a file name that climbs out of its folder', async () => {
    const before = await attachmentCount();
    for (const name of ['../../etc/passwd.jpg', '..\\..\\windows\\win.ini.jpg', 'photos/../../x.jpg']) {
      const res = await rawUpload(technician, workOrderId, await jpeg(), name);
      expect(res.status).withContext(name).toBe(400);
    }
    expect(await attachmentCount()).toBe(before);
  });

  it('lets nobody but the contractor on the job and the manager upload', async () => {
    const idle = await world.signedIn(world.people.idleTech);
    expect((await upload(idle, workOrderId, await jpeg(), 'x.jpg', 'image/jpeg')).status).toBe(404);
    const tenant = await world.signedIn(world.people.tenantA);
    expect((await upload(tenant, workOrderId, await jpeg(), 'x.jpg', 'image/jpeg')).status).toBe(403);
  });
});
