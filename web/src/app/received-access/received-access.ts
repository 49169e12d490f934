import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressSpinnerModule } from '@angular/material/progress-spinner';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { Grant } from '@cellwarden/shared';
import { Auth } from '../core/auth';
import { AccessApi } from '../core/access-api';
import { grantState } from '../core/grant-state';
import { LoadState, loadedOr, toLoadState } from '../core/load-state';

/** Route shared-with-me: the systems others let me (or my company) see, and until when. */
@Component({
  selector: 'cw-received-access',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatTableModule, MatButtonModule, MatProgressSpinnerModule, RouterLink, DatePipe],
  templateUrl: './received-access.html',
  styleUrl: '../access/access-tables.scss',
})
export class ReceivedAccess {
  private readonly api = inject(AccessApi);
  private readonly auth = inject(Auth);

  /** Installers and admins also get a link to each active system's commissioning screen. */
  protected readonly columns = computed(() =>
    this.auth.hasAnyRole(['installer', 'admin'])
      ? ['system', 'through', 'access', 'expires', 'state', 'tools']
      : ['system', 'through', 'access', 'expires', 'state'],
  );
  protected readonly state = toSignal(
    toLoadState(this.api.receivedGrants(), 'The shared systems could not be loaded.'),
    {
      initialValue: { status: 'loading' } as LoadState<Grant[]>,
    },
  );
  protected readonly rows = computed(() =>
    loadedOr(this.state(), []).map((grant) => ({
      grant,
      through: grant.granteeCompany ? `${grant.granteeCompany.name} (company)` : 'You personally',
      state: grantState(grant, Date.now()),
    })),
  );
}
