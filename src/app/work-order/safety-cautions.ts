import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The cautions before anyone touches the appliance, at the top of the job where they cannot be missed. */
@Component({
  selector: 'cw-safety-cautions',
  imports: [MatIconModule],
  template: `<section class="cautions" aria-labelledby="cautions-heading">
    <h2 id="cautions-heading"><mat-icon aria-hidden="true">warning</mat-icon>Before you touch the appliance</h2>
    <ul>
      @for (caution of cautions(); track caution) {
        <li>{{ caution }}</li>
      }
    </ul>
  </section>`,
  styleUrl: './safety-cautions.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SafetyCautions {
  readonly cautions = input.required<readonly string[]>();
}
