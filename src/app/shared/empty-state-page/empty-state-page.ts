import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { RouterLink } from '@angular/router';
import { EmptyState } from '../empty-state/empty-state';

/**
 * A page whose content is not there yet, described by its route's data: the title, what
 * will appear and where to go meanwhile. Routes graduate to their own feature pages.
 */
@Component({
  selector: 'cw-empty-state-page',
  imports: [EmptyState, MatButtonModule, RouterLink],
  templateUrl: './empty-state-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmptyStatePage {
  readonly title = input.required<string>();
  readonly lead = input('');
  readonly icon = input('inbox');
  readonly heading = input.required<string>();
  readonly message = input('');
  readonly actionLabel = input<string | null>(null);
  readonly actionLink = input<string | null>(null);
}
