import { ChangeDetectionStrategy, Component } from '@angular/core';
import { Shell } from './core/layout/shell';

@Component({
  selector: 'cw-root',
  imports: [Shell],
  template: '<cw-shell />',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class App {}
