import { Injectable, computed, effect, inject, signal } from '@angular/core';
import { catchError, forkJoin, of } from 'rxjs';
import { Auth } from './auth';
import { OnboardingApi } from './onboarding-api';
import { RequestsApi } from './requests-api';

/** How often the shell's notice asks for new requests while someone is signed in. */
const REFRESH_MS = 60_000;

/** What waits for the signed-in person's answer: access requests on their systems and systems set up for them. */
@Injectable({ providedIn: 'root' })
export class RequestsNotice {
  private readonly auth = inject(Auth);
  private readonly requests = inject(RequestsApi);
  private readonly onboarding = inject(OnboardingApi);
  private readonly waiting = signal(0);

  /** Requests and hand-overs waiting for an answer; 0 when signed out. */
  readonly count = computed(() => (this.auth.isSignedIn() ? this.waiting() : 0));

  constructor() {
    effect((onCleanup) => {
      if (!this.auth.isSignedIn()) return;
      this.refresh();
      const timer = setInterval(() => this.refresh(), REFRESH_MS);
      onCleanup(() => clearInterval(timer));
    });
  }

  /** Asks again now (after answering a request, for instance). */
  refresh(): void {
    forkJoin([
      this.requests.incoming().pipe(catchError(() => of([]))),
      this.onboarding.handovers().pipe(catchError(() => of([]))),
    ]).subscribe(([incoming, handovers]) => this.waiting.set(incoming.length + handovers.length));
  }
}
