import { Injectable, InjectionToken, effect, inject, signal, untracked } from '@angular/core';
import {
  STREAM_PROTOCOL,
  STREAM_TOKEN_PREFIX,
  type AlertEvent,
  type DerivedState,
  type ReceivedReading,
  type StreamMessage,
} from '@cellwarden/shared';
import { Observable, Subject, filter, map, retry, share, tap, timer } from 'rxjs';
import { WebSocketSubject, WebSocketSubjectConfig, webSocket } from 'rxjs/webSocket';
import { Auth } from './auth';
import { OfflineStore } from './offline/offline-store';

export type { StreamMessage } from '@cellwarden/shared';

/** What the stream says about one system. */
export type SystemStreamEvent =
  | { type: 'reading'; reading: ReceivedReading; derived: DerivedState | null }
  | { type: 'alert'; alert: AlertEvent }
  | { type: 'access-ended' };

/** The state of the one WebSocket. */
export type ConnectionState = 'connecting' | 'open' | 'closed';

/** Creates the socket; replaced in tests. */
export const WEB_SOCKET_FACTORY = new InjectionToken<
  (config: WebSocketSubjectConfig<unknown>) => WebSocketSubject<unknown>
>('WEB_SOCKET_FACTORY', { providedIn: 'root', factory: () => webSocket });

/** Back-off before reconnect attempt n (0-based): 1 s, 2 s, 4 s … capped at 30 s. */
export function reconnectDelay(attempt: number): number {
  return Math.min(1000 * 2 ** attempt, 30_000);
}

/** Owns the single WebSocket to /api/stream and hands out readings per system. */
@Injectable({ providedIn: 'root' })
export class LiveStream {
  private readonly auth = inject(Auth);
  private readonly createSocket = inject(WEB_SOCKET_FACTORY);
  private readonly offline = inject(OfflineStore);
  // How many subscribers watch each system; the server hears of a system once.
  private readonly watchers = new Map<string, number>();
  private socket: WebSocketSubject<unknown> | null = null;
  private readonly state = signal<ConnectionState>('closed');
  private messages$: Observable<StreamMessage> | null = null;
  private readonly errors = new Subject<{ code: string; message: string }>();

  /** 'connecting' | 'open' | 'closed'. */
  readonly connectionState = this.state.asReadonly();
  /** Errors the server reports on the stream. */
  readonly streamErrors$ = this.errors.asObservable();
  // The token the open socket runs on; the server closes it when that token lapses unless renewed.
  private socketToken: string | null = null;

  constructor() {
    // Each refreshed access token is handed to the open socket, so the stream outlives the one it began with.
    effect(() => {
      const token = this.auth.accessToken();
      untracked(() => this.renew(token));
    });
  }

  /** Readings, alerts and the end of access for one system; subscribing opens the socket if needed. */
  events(systemId: string): Observable<SystemStreamEvent> {
    return new Observable<SystemStreamEvent>((subscriber) => {
      this.watchers.set(systemId, (this.watchers.get(systemId) ?? 0) + 1);
      this.sendSubscribe();
      const inner = this.messages()
        .pipe(
          map((message) => eventFor(message, systemId)),
          filter((event): event is SystemStreamEvent => event !== null),
          // Each live value is also kept for the offline view, so the last one survives a lost signal.
          tap((event) => event.type === 'reading' && this.offline.recordReading(systemId, event)),
        )
        .subscribe(subscriber);
      return () => {
        inner.unsubscribe();
        const left = (this.watchers.get(systemId) ?? 1) - 1;
        if (left > 0) this.watchers.set(systemId, left);
        else {
          this.watchers.delete(systemId);
          this.sendUnsubscribe(systemId);
        }
      };
    });
  }

  /** Readings of one system. */
  readings(systemId: string): Observable<ReceivedReading> {
    return this.events(systemId).pipe(
      filter((event) => event.type === 'reading'),
      map((event) => event.reading),
    );
  }

  private messages(): Observable<StreamMessage> {
    this.messages$ ??= new Observable<StreamMessage>((subscriber) => {
      this.state.set('connecting');
      const socket = this.openSocket();
      const inner = socket.subscribe({
        next: (message) => {
          const typed = message as StreamMessage;
          if (typed.type === 'error') this.errors.next({ code: typed.code, message: typed.message });
          // A reconnect must not ask again for systems whose access has ended.
          if (typed.type === 'access-ended') typed.systemIds.forEach((id) => this.watchers.delete(id));
          subscriber.next(typed);
        },
        error: (error: unknown) => {
          this.state.set('closed');
          subscriber.error(error);
        },
        complete: () => {
          this.state.set('closed');
          subscriber.error(new Error('stream closed by server'));
        },
      });
      return () => {
        inner.unsubscribe();
        this.socket = null;
        this.state.set('closed');
      };
    }).pipe(
      retry({ delay: (_error, retryCount) => timer(reconnectDelay(retryCount - 1)), resetOnSuccess: true }),
      share(),
    );
    return this.messages$;
  }

  private openSocket(): WebSocketSubject<unknown> {
    const protocol = location.protocol === 'https:' ? 'wss:' : 'ws:';
    const token = this.auth.accessToken() ?? '';
    this.socketToken = token;
    const socket = this.createSocket({
      url: `${protocol}//${location.host}/api/stream`,
      protocol: [STREAM_PROTOCOL, `${STREAM_TOKEN_PREFIX}${token}`],
      openObserver: {
        next: () => {
          this.state.set('open');
          this.sendSubscribe();
        },
      },
    });
    this.socket = socket;
    return socket;
  }

  private renew(token: string | null): void {
    if (!token || token === this.socketToken || !this.socket || this.state() !== 'open') return;
    this.socketToken = token;
    this.socket.next({ type: 'renew', token });
  }

  private sendUnsubscribe(systemId: string): void {
    if (this.socket && this.state() === 'open') {
      this.socket.next({ type: 'unsubscribe', systemIds: [systemId] });
    }
  }

  private sendSubscribe(): void {
    if (this.socket && this.state() === 'open') {
      this.socket.next({ type: 'subscribe', systemIds: [...this.watchers.keys()] });
    }
  }
}

/** The part of a stream message that concerns one system, or null. */
export function eventFor(message: StreamMessage, systemId: string): SystemStreamEvent | null {
  switch (message.type) {
    case 'reading':
      return message.systemId === systemId
        ? { type: 'reading', reading: message.reading, derived: message.derived ?? null }
        : null;
    case 'alert':
      return message.systemId === systemId ? { type: 'alert', alert: message.alert } : null;
    case 'access-ended':
      return message.systemIds.includes(systemId) ? { type: 'access-ended' } : null;
    default:
      return null;
  }
}
