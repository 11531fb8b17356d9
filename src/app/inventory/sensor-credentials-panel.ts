import { Clipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { SensorCredentials } from '../../../shared/api/inventory';
import { readingTopic } from '../../../shared/telemetry';

/**
 * A sensor's device id and one-time secret, to be entered into the device. The secret is
 * in this answer only: the server keeps its hash.
 */
@Component({
  selector: 'cw-sensor-credentials-panel',
  imports: [MatButtonModule, MatIconModule],
  templateUrl: './sensor-credentials-panel.html',
  styleUrl: './sensor-credentials-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SensorCredentialsPanel {
  private readonly clipboard = inject(Clipboard);

  readonly credentials = input.required<SensorCredentials>();
  protected readonly topic = computed(() => readingTopic(this.credentials().deviceId));
  protected readonly copied = signal<string | null>(null);

  protected copy(what: 'device id' | 'secret' | 'topic', text: string): void {
    this.copied.set(this.clipboard.copy(text) ? `The ${what} is copied.` : `Select the ${what} and copy it by hand.`);
  }
}
