import { Injectable, inject } from '@angular/core';
import type { SystemStatus, SystemSummary } from '@cellwarden/shared';
import { Observable, Subscription, catchError, from, map, shareReplay } from 'rxjs';
import { Api } from './api';
import { LiveStream, type SystemStreamEvent } from './live-stream';
import { OfflineStore } from './offline/offline-store';
import { STATUS_HEAD_START, SYSTEM_HEAD_START } from './session-head-start';

/** How long a head start waits for its view before it lets go of the socket subscription it holds. */
const UNCLAIMED_AFTER_MS = 10_000;

interface Pending {
  systemId: string;
  status: Observable<SystemStatus>;
  /** Stream events that arrived before the view took over. */
  early: SystemStreamEvent[];
  holds: Subscription;
  statusClaimed: boolean;
  eventsClaimed: boolean;
  expiry: ReturnType<typeof setTimeout>;
}

/**
 * Asks for a system's status and subscribes to its stream as soon as the session is known, while the live view's
 * code is still downloading; the view then takes both over instead of asking again (each once). Before, the
 * status request and the socket waited for the view's code, about a quarter of a second after the session.
 */
@Injectable({ providedIn: 'root' })
export class LiveHeadStart {
  private readonly api = inject(Api);
  private readonly stream = inject(LiveStream);
  private readonly offline = inject(OfflineStore);
  private readonly takeEarlyStatus = inject(STATUS_HEAD_START);
  private readonly takeEarlySystem = inject(SYSTEM_HEAD_START);
  private pending: Pending | null = null;

  /** Starts the status request and the stream subscription for `systemId`, dropping an unclaimed earlier one. */
  start(systemId: string): void {
    this.release();
    const status = this.statusRequest(systemId).pipe(shareReplay({ bufferSize: 1, refCount: false }));
    const pending: Pending = {
      systemId,
      status,
      early: [],
      holds: new Subscription(),
      statusClaimed: false,
      eventsClaimed: false,
      expiry: setTimeout(() => this.release(), UNCLAIMED_AFTER_MS),
    };
    // Errors reach the view through its own subscription to the replayed status; here they are only held.
    pending.holds.add(status.subscribe({ error: () => undefined }));
    pending.holds.add(
      this.stream.events(systemId).subscribe({ next: (e) => pending.early.push(e), error: () => undefined }),
    );
    this.pending = pending;
  }

  /** The system's status: the one already asked for if it is this system's and untaken, else a new request. */
  status(systemId: string): Observable<SystemStatus> {
    const pending = this.pending;
    if (!pending || pending.systemId !== systemId || pending.statusClaimed) return this.api.status(systemId);
    pending.statusClaimed = true;
    this.releaseIfClaimed();
    return pending.status;
  }

  /**
   * The system's description: the one the page's head-start script asked for (for its first glance) if it is
   * this system's and untaken, else a new request; a failed early answer asks again the usual way.
   */
  system(systemId: string): Observable<SystemSummary> {
    const early = this.takeEarlySystem(systemId);
    if (!early) return this.api.system(systemId);
    return from(early).pipe(
      map((answer) => {
        if (!answer.body || answer.status < 200 || answer.status >= 300) throw new Error('no early system');
        return answer.body.system;
      }),
      catchError(() => this.api.system(systemId)),
    );
  }

  /** The system's stream events: those that came early first, then the live ones, as `LiveStream.events`. */
  events(systemId: string): Observable<SystemStreamEvent> {
    const pending = this.pending;
    if (!pending || pending.systemId !== systemId || pending.eventsClaimed)
      return this.stream.events(systemId);
    pending.eventsClaimed = true;
    return new Observable<SystemStreamEvent>((subscriber) => {
      pending.early.forEach((e) => subscriber.next(e));
      pending.early = [];
      // The view's own subscription is counted before the head start's ends, so the server never hears an
      // unsubscribe in between; nothing can arrive between the two, as both happen in this one task.
      const inner = this.stream.events(systemId).subscribe(subscriber);
      this.releaseIfClaimed();
      return inner;
    });
  }

  /**
   * The status request the page's head-start script already sent if it is this system's; it bypassed the HTTP
   * interceptors, so its answer is kept for offline use here, and any failure asks again the usual way (which
   * renews the token or sends the visitor to sign-in as every request does).
   */
  private statusRequest(systemId: string): Observable<SystemStatus> {
    const early = this.takeEarlyStatus(systemId);
    if (!early) return this.api.status(systemId);
    return from(early).pipe(
      map((answer) => {
        if (!answer.body || answer.status < 200 || answer.status >= 300) throw new Error('no early status');
        this.offline.recordStatus(answer.body.status);
        return answer.body.status;
      }),
      catchError(() => this.api.status(systemId)),
    );
  }

  private releaseIfClaimed(): void {
    if (this.pending?.statusClaimed && this.pending.eventsClaimed && this.pending.early.length === 0)
      this.release();
  }

  private release(): void {
    if (!this.pending) return;
    clearTimeout(this.pending.expiry);
    this.pending.holds.unsubscribe();
    this.pending = null;
  }
}
