import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { Shell } from './core/shell/shell';
import { Theme } from './core/theme';

/** The root: the shell around the routed screens. */
@Component({
  selector: 'cw-root',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [Shell],
  template: '<cw-shell />',
})
export class App {
  // Injected eagerly so the remembered theme applies before the first paint.
  private readonly theme = inject(Theme);
}
