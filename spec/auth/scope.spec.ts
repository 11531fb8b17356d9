import type { Actor } from '../../server/auth/actor';
import { Scope } from '../../server/auth/scope';
import { Unit } from '../../server/entities/unit';
import { createWorld, type Person, type World, SPEC_TIMEOUT_MS } from './support/world';

describe('Scope: who reaches which unit and appliance', () => {
  let world: World;
  let scope: Scope;
  const actor = (person: Person): Actor => {
    const user = world.fixtures.users[person];
    return { id: user.id, email: user.email, displayName: person, role: user.role, isAdmin: user.isAdmin, organizationId: user.organizationId, unitId: user.unitId, temperatureUnit: 'F', timeZone: null };
  };

  beforeAll(async () => {
    world = await createWorld();
    scope = new Scope(world.db.dataSource);
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it('gives a tenant their own unit and its appliance, and nothing else', async () => {
    const { org1, org2 } = world.fixtures;
    expect(await scope.canReadUnit(actor('tenantA'), org1.unitA)).toBeTrue();
    expect(await scope.canReadAppliance(actor('tenantA'), org1.applianceA)).toBeTrue();
    expect(await scope.canReadUnit(actor('tenantA'), org1.unitB)).toBeFalse();
    expect(await scope.canReadUnit(actor('tenantB'), org1.unitA)).toBeFalse();
    expect(await scope.canReadAppliance(actor('tenantB'), org1.applianceA)).toBeFalse();
    expect(await scope.canReadUnit(actor('tenantA'), org2.unitC)).toBeFalse();
    expect(await scope.canReadProperty(actor('tenantA'), org1.propertyId)).toBeFalse();
  }, SPEC_TIMEOUT_MS);

  it('gives a manager their whole organization and nothing of another', async () => {
    const { org1, org2 } = world.fixtures;
    for (const person of ['managerOrg1', 'adminOrg1'] as const) {
      expect(await scope.canReadUnit(actor(person), org1.unitB)).toBeTrue();
      expect(await scope.canReadAppliance(actor(person), org1.applianceA)).toBeTrue();
      expect(await scope.canReadProperty(actor(person), org1.propertyId)).toBeTrue();
      expect(await scope.canReadAppliance(actor(person), org2.applianceC)).toBeFalse();
      expect(await scope.canReadProperty(actor(person), org2.propertyId)).toBeFalse();
    }
    expect(await scope.canReadAppliance(actor('adminOrg2'), org2.applianceC)).toBeTrue();
    expect(await scope.canReadAppliance(actor('adminOrg2'), org1.applianceA)).toBeFalse();
  }, SPEC_TIMEOUT_MS);

  it('answers "not found" alike for another organization\'s record and a missing one', async () => {
    const someone = actor('adminOrg2');
    const outOfScope = await scope.requireAppliance(someone, world.fixtures.org1.applianceA).catch((error) => error);
    const missing = await scope.requireAppliance(someone, '00000000-0000-4000-8000-000000000000').catch((error) => error);
    const malformed = await scope.requireAppliance(someone, 'not-a-uuid').catch((error) => error);
    for (const error of [outOfScope, missing, malformed]) expect({ status: error.status, message: error.message }).toEqual({ status: 404, message: 'appliance not found' });
  }, SPEC_TIMEOUT_MS);

  it('narrows unit lists to what the actor reaches', async () => {
    const { org1, org2 } = world.fixtures;
    const visible = async (person: Person) => {
      const query = world.db.dataSource.getRepository(Unit).createQueryBuilder('unit').innerJoin('unit.property', 'property');
      return (await scope.restrictUnits(query, actor(person), { unit: 'unit', property: 'property' }).getMany()).map((unit) => unit.id).sort();
    };
    expect(await visible('managerOrg1')).toEqual([org1.unitA, org1.unitB].sort());
    expect(await visible('adminOrg2')).toEqual([org2.unitC]);
    expect(await visible('tenantB')).toEqual([org1.unitB]);
    expect(await visible('contractorWithoutJob')).toEqual([]);
  }, SPEC_TIMEOUT_MS);

  it('ignores a unit that was archived', async () => {
    const { org1 } = world.fixtures;
    await world.db.dataSource.query('UPDATE unit SET archived_at = now() WHERE id = $1', [org1.unitB]);
    try {
      expect(await scope.canReadUnit(actor('tenantB'), org1.unitB)).toBeFalse();
      await expectAsync(scope.requireManagedUnit(actor('adminOrg1'), org1.unitB)).toBeRejectedWith(jasmine.objectContaining({ status: 404 }));
    } finally {
      await world.db.dataSource.query('UPDATE unit SET archived_at = NULL WHERE id = $1', [org1.unitB]);
    }
  }, SPEC_TIMEOUT_MS);
});
