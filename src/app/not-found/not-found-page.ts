import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { Session } from '../core/auth/session';
import { EmptyState } from '../shared/empty-state/empty-state';

@Component({
  selector: 'cw-not-found-page',
  imports: [EmptyState, MatButtonModule, RouterLink],
  template: `
    <div class="cw-page">
      <cw-empty-state icon="explore_off" heading="There is no page here" message="The link may be old, or the page may have moved.">
        <a mat-flat-button [routerLink]="session.homePath()">Go to your start page</a>
      </cw-empty-state>
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {
  protected readonly session = inject(Session);
}
