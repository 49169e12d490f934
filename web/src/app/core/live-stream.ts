import { Injectable, InjectionToken, inject, signal } from '@angular/core';
import type { BatteryReading } from '@cellwarden/shared';
import { Observable, Subject, filter, map, retry, share, timer } from 'rxjs';
import { WebSocketSubject, WebSocketSubjectConfig, webSocket } from 'rxjs/webSocket';
import { Auth } from './auth';

/** Messages the server sends on /api/stream. */
export type StreamMessage =
  | { type: 'subscribed'; systemIds: string[] }
  | { type: 'reading'; systemId: string; reading: BatteryReading }
  | { type: 'error'; error: { code: string; message: string } };

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
  private readonly systemIds = new Set<string>();
  private socket: WebSocketSubject<unknown> | null = null;
  private readonly state = signal<ConnectionState>('closed');
  private messages$: Observable<StreamMessage> | null = null;
  private readonly errors = new Subject<{ code: string; message: string }>();

  /** 'connecting' | 'open' | 'closed'. */
  readonly connectionState = this.state.asReadonly();
  /** Errors the server reports on the stream. */
  readonly streamErrors$ = this.errors.asObservable();

  /** Readings of one system; subscribing opens the socket if needed and subscribes to the system. */
  readings(systemId: string): Observable<BatteryReading> {
    return new Observable<BatteryReading>((subscriber) => {
      this.systemIds.add(systemId);
      this.sendSubscribe();
      const inner = this.messages()
        .pipe(
          filter((m): m is Extract<StreamMessage, { type: 'reading' }> => m.type === 'reading'),
          filter((m) => m.systemId === systemId),
          map((m) => m.reading),
        )
        .subscribe(subscriber);
      return () => {
        inner.unsubscribe();
        this.systemIds.delete(systemId);
      };
    });
  }

  private messages(): Observable<StreamMessage> {
    this.messages$ ??= new Observable<StreamMessage>((subscriber) => {
      this.state.set('connecting');
      const socket = this.openSocket();
      const inner = socket.subscribe({
        next: (message) => {
          const typed = message as StreamMessage;
          if (typed.type === 'error') this.errors.next(typed.error);
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
    const socket = this.createSocket({
      url: `${protocol}//${location.host}/api/stream`,
      protocol: ['cellwarden.v1', `bearer.${token}`],
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

  private sendSubscribe(): void {
    if (this.socket && this.state() === 'open') {
      this.socket.next({ type: 'subscribe', systemIds: [...this.systemIds] });
    }
  }
}
