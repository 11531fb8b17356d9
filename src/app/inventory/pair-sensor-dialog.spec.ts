import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component, inject } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { ApplianceView, SensorCredentials } from '../../../shared/api/inventory';
import { PairSensorDialog } from './pair-sensor-dialog';
import { appliance, configureSpec, sensor, settle } from './testing';

@Component({ template: '' })
class Opener {
  readonly dialog = inject(MatDialog);
  closedWith: SensorCredentials | undefined;
  open(data: ApplianceView): void {
    this.dialog.open(PairSensorDialog, { data }).afterClosed().subscribe((paired) => (this.closedWith = paired));
  }
}

const SECRET = 'Zm9yLXNwZWNzLW9ubHktbm90LWEtcmVhbC1zZWNyZXQ';

describe('PairSensorDialog', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  async function open(data: ApplianceView) {
    const fixture = TestBed.createComponent(Opener);
    fixture.componentInstance.open(data);
    await settle(fixture);
    return { fixture, root: TestbedHarnessEnvironment.documentRootLoader(fixture) };
  }

  it('pairs a sensor and shows its device id and one-time secret until dismissed', async () => {
    const { fixture, root } = await open(appliance(1));
    await (await root.getHarness(MatSelectHarness)).clickOptions({ text: 'Every minute' });
    await (await root.getHarness(MatButtonHarness.with({ text: 'Pair sensor' }))).click();
    const call = backend.expectOne('/api/inventory/appliances/a1/sensor');
    expect(call.request.body).toEqual({ deviceId: undefined, intervalSeconds: 60, replace: false });
    call.flush({ sensor: sensor(1), deviceId: 'cw-0a1b2c3d4e5f', secret: SECRET } satisfies SensorCredentials);
    await settle(fixture);
    const shown = document.querySelector('[data-field="secret"]')?.textContent;
    expect(shown).toBe(SECRET);
    expect(document.querySelector('[data-field="deviceId"]')?.textContent).toBe('cw-0a1b2c3d4e5f');
    // The topic the device publishes to: cw/v1/s/<shard>/<device id>/reading (shared/telemetry.ts).
    expect(document.body.textContent).toMatch(/cw\/v1\/s\/\d+\/cw-0a1b2c3d4e5f\/reading/);
    expect(document.body.textContent).toContain('EPA Section 608');
    await (await root.getHarness(MatButtonHarness.with({ text: 'I have entered the secret' }))).click();
    for (let i = 0; i < 50 && !fixture.componentInstance.closedWith; i++) await settle(fixture);
    expect(fixture.componentInstance.closedWith?.deviceId).toBe('cw-0a1b2c3d4e5f');
  });

  it('asks to confirm replacing the sensor an appliance already has', async () => {
    const paired = appliance(2, { sensor: { id: 's2', deviceId: 'cw-old', intervalSeconds: 300, lastSeenAt: null } });
    const { fixture, root } = await open(paired);
    await (await root.getHarness(MatButtonHarness.with({ text: 'Pair sensor' }))).click();
    await settle(fixture);
    backend.expectNone('/api/inventory/appliances/a2/sensor');
    expect(document.body.textContent).toContain('tick the box to replace it');
    await (await root.getHarness(MatCheckboxHarness)).check();
    await (await root.getHarness(MatInputHarness.with({ selector: '[formControlName="deviceId"]' }))).setValue('lobby-probe-7');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Pair sensor' }))).click();
    const call = backend.expectOne('/api/inventory/appliances/a2/sensor');
    expect(call.request.body).toEqual({ deviceId: 'lobby-probe-7', intervalSeconds: 300, replace: true });
    call.flush({ error: 'device id lobby-probe-7 is already registered' }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect(document.body.textContent).toContain('Device id lobby-probe-7 is already registered');
  });
});
