import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconButton } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatSidenav, MatSidenavContainer, MatSidenavContent } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { catchError, map, of, switchMap } from 'rxjs';
import { MailOutboxApi } from '../../mail-outbox/mail-outbox-api';
import { RequestsNotice } from '../requests-notice';
import { Auth } from '../auth';
import { OfflineStore } from '../offline/offline-store';
import { Theme } from '../theme';
import { OfflinePanel } from './offline-panel/offline-panel';

/** The app frame: toolbar, side navigation, main landmark and safety footer. */
@Component({
  selector: 'cw-shell',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    MatToolbarModule,
    // Single components rather than whole modules, and plain links for the navigation: Material's list module
    // is shared with lazy screens whole, selection list and @angular/forms included, so it would load first.
    MatSidenav,
    MatSidenavContainer,
    MatSidenavContent,
    MatIconButton,
    MatIconModule,
    MatMenu,
    MatMenuItem,
    MatMenuTrigger,
    RouterOutlet,
    RouterLink,
    RouterLinkActive,
    OfflinePanel,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
})
export class Shell {
  protected readonly auth = inject(Auth);
  protected readonly theme = inject(Theme);
  protected readonly offline = inject(OfflineStore);
  /** Access requests and systems set up for me, waiting for my answer (a count beside Requests). */
  protected readonly requestsNotice = inject(RequestsNotice);
  private readonly breakpoints = inject(BreakpointObserver);
  private readonly mailOutbox = inject(MailOutboxApi);

  protected readonly isPhone = toSignal(
    this.breakpoints.observe('(max-width: 599.98px)').pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  /** Whether the server keeps a local copy of mail (its catcher runs): only then is "Your mail" listed. */
  protected readonly mailCatcherOn = toSignal(
    toObservable(this.auth.isSignedIn).pipe(
      switchMap((signedIn) =>
        signedIn
          ? this.mailOutbox.ownMail().pipe(
              map((own) => own.catcher),
              catchError(() => of(false)),
            )
          : of(false),
      ),
    ),
    { initialValue: false },
  );
  protected readonly themeLabel = computed(() =>
    this.theme.mode() === 'dark' ? 'Switch to light theme' : 'Switch to dark theme',
  );

  /** Signs out and forgets the values kept for offline use, so the next person here sees none. */
  protected signOut(): void {
    this.offline.forget();
    this.auth.signOut();
  }

  /** Moves focus to the main landmark; the plain #main link would go through the router. */
  protected skipToMain(event: Event): void {
    event.preventDefault();
    document.getElementById('main')?.focus();
  }
}
