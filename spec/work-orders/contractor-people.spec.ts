/** The people a manager may add to a contractor company: the organization's own contractor users only. */
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

describe('contractor users a manager can add as members', () => {
  let world: WorkOrderWorld;

  beforeAll(async () => {
    world = await createWorkOrderWorld({ units: 1 });
  }, 30_000);
  afterAll(async () => world.close());

  it("lists the organization's active contractor users, and nobody of another organization", async () => {
    const manager = await world.signedIn(world.people.manager);
    const res = await manager.get('/api/contractors/people');
    expect(res.status).toBe(200);
    const ids = (res.body as { userId: string }[]).map((person) => person.userId);
    expect(ids).toEqual(jasmine.arrayWithExactContents([world.people.primaryTech.id, world.people.backupTech.id, world.people.idleTech.id]));
    expect(ids).not.toContain(world.people.tenantA.id);

    await world.db.dataSource.query(`UPDATE app_user SET deactivated_at = now() WHERE id = $1`, [world.people.idleTech.id]);
    const after = await manager.get('/api/contractors/people');
    expect((after.body as { userId: string }[]).map((person) => person.userId)).not.toContain(world.people.idleTech.id);

    const outsider = await world.signedIn(world.people.outsider);
    expect((await outsider.get('/api/contractors/people')).body).toEqual([]);
    expect((await (await world.signedIn(world.people.tenantA)).get('/api/contractors/people')).status).toBe(403);
  });
});
