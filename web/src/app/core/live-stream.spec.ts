import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { Subject } from 'rxjs';
import type { WebSocketSubjectConfig } from 'rxjs/webSocket';
import { Auth } from './auth';
import { LiveStream, WEB_SOCKET_FACTORY, reconnectDelay } from './live-stream';

class FakeSocket extends Subject<unknown> {
  readonly sent: unknown[] = [];
  constructor(readonly config: WebSocketSubjectConfig<unknown>) {
    super();
  }
  override next(value: unknown): void {
    this.sent.push(value);
  }
  open(): void {
    this.config.openObserver?.next(new Event('open'));
  }
  receive(message: unknown): void {
    super.next(message);
  }
}

describe('LiveStream', () => {
  let sockets: FakeSocket[];

  beforeEach(() => {
    jest.useFakeTimers();
    sockets = [];
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        {
          provide: WEB_SOCKET_FACTORY,
          useValue: (config: WebSocketSubjectConfig<unknown>) => {
            const socket = new FakeSocket(config);
            sockets.push(socket);
            return socket;
          },
        },
      ],
    });
  });
  afterEach(() => jest.useRealTimers());

  it('opens one socket with the Cellwarden subprotocols and subscribes to the system', () => {
    const stream = TestBed.inject(LiveStream);
    stream.readings('van-1').subscribe();
    expect(stream.connectionState()).toBe('connecting');
    sockets[0].open();
    expect(stream.connectionState()).toBe('open');
    expect(sockets[0].config.protocol).toEqual(['cellwarden.v1', 'bearer.']);
    expect(sockets[0].sent).toEqual([{ type: 'subscribe', systemIds: ['van-1'] }]);
  });

  it('hands a refreshed access token to the open socket so the server keeps it open', () => {
    const stream = TestBed.inject(LiveStream);
    const auth = TestBed.inject(Auth);
    const http = TestBed.inject(HttpTestingController);
    stream.readings('van-1').subscribe();
    sockets[0].open();
    auth.refresh().subscribe();
    const user = { id: 'u1', email: 'a@b.example', displayName: 'A', roles: ['owner'], companyId: null };
    http.expectOne('/api/auth/refresh').flush({ accessToken: 'fresh-token', expiresIn: 900, user });
    TestBed.tick();
    expect(sockets[0].sent).toContainEqual({ type: 'renew', token: 'fresh-token' });
    expect(sockets).toHaveLength(1);
  });

  it('routes each reading to the subscriber of its system', () => {
    const stream = TestBed.inject(LiveStream);
    const van: number[] = [];
    const boat: number[] = [];
    stream.readings('van-1').subscribe((r) => van.push(r.voltage));
    stream.readings('boat-1').subscribe((r) => boat.push(r.voltage));
    expect(sockets).toHaveLength(1);
    sockets[0].open();
    const reading = (voltage: number) => ({ measuredAt: 1, voltage, current: 1, temperature: 20 });
    sockets[0].receive({ type: 'reading', systemId: 'van-1', reading: reading(13.1) });
    sockets[0].receive({ type: 'reading', systemId: 'boat-1', reading: reading(26.2) });
    expect(van).toEqual([13.1]);
    expect(boat).toEqual([26.2]);
  });

  it('reconnects with exponential back-off after the socket fails', () => {
    const stream = TestBed.inject(LiveStream);
    stream.readings('van-1').subscribe();
    sockets[0].error(new Error('gone'));
    expect(stream.connectionState()).toBe('closed');
    jest.advanceTimersByTime(999);
    expect(sockets).toHaveLength(1);
    jest.advanceTimersByTime(1);
    expect(sockets).toHaveLength(2);
    sockets[1].error(new Error('gone again'));
    jest.advanceTimersByTime(1999);
    expect(sockets).toHaveLength(2);
    jest.advanceTimersByTime(1);
    expect(sockets).toHaveLength(3);
  });

  it('hands a system its alerts and the end of its access, and nothing of other systems', () => {
    const stream = TestBed.inject(LiveStream);
    const events: string[] = [];
    stream.events('van-1').subscribe((e) => events.push(e.type));
    sockets[0].open();
    const alert = {
      id: 'a1',
      systemId: 'van-1',
      kind: 'low-charge',
      severity: 'warning',
      startedAt: 1,
      endedAt: null,
    };
    sockets[0].receive({ type: 'alert', systemId: 'van-1', alert });
    sockets[0].receive({ type: 'alert', systemId: 'boat-1', alert: { ...alert, systemId: 'boat-1' } });
    sockets[0].receive({ type: 'access-ended', systemIds: ['boat-1'] });
    sockets[0].receive({ type: 'access-ended', systemIds: ['van-1', 'boat-1'] });
    expect(events).toEqual(['alert', 'access-ended']);
  });

  it('passes the derived state along with each reading', () => {
    const stream = TestBed.inject(LiveStream);
    const derived: unknown[] = [];
    stream.events('van-1').subscribe((e) => e.type === 'reading' && derived.push(e.derived));
    sockets[0].open();
    const reading = { measuredAt: 1, receivedAt: 1, voltage: 13, current: 1, temperature: 20 };
    sockets[0].receive({ type: 'reading', systemId: 'van-1', reading, derived: { hoursToEmpty: 12 } });
    sockets[0].receive({ type: 'reading', systemId: 'van-1', reading });
    expect(derived).toEqual([{ hoursToEmpty: 12 }, null]);
  });

  it('reports server errors on the stream with their code', () => {
    const stream = TestBed.inject(LiveStream);
    const errors: unknown[] = [];
    stream.streamErrors$.subscribe((e) => errors.push(e));
    stream.readings('van-1').subscribe();
    sockets[0].open();
    sockets[0].receive({ type: 'error', code: 'forbidden', message: 'No access to van-1' });
    expect(errors).toEqual([{ code: 'forbidden', message: 'No access to van-1' }]);
  });

  it('tells the server once the last watcher of a system leaves', () => {
    const stream = TestBed.inject(LiveStream);
    stream.readings('boat-1').subscribe();
    const first = stream.readings('van-1').subscribe();
    const second = stream.readings('van-1').subscribe();
    sockets[0].open();
    first.unsubscribe();
    expect(sockets[0].sent).not.toContainEqual({ type: 'unsubscribe', systemIds: ['van-1'] });
    second.unsubscribe();
    expect(sockets[0].sent).toContainEqual({ type: 'unsubscribe', systemIds: ['van-1'] });
  });

  it('does not ask again for a system whose access ended when it reconnects', () => {
    const stream = TestBed.inject(LiveStream);
    stream.readings('van-1').subscribe();
    stream.readings('boat-1').subscribe();
    sockets[0].open();
    sockets[0].receive({ type: 'access-ended', systemIds: ['boat-1'] });
    sockets[0].error(new Error('gone'));
    jest.advanceTimersByTime(1000);
    sockets[1].open();
    expect(sockets[1].sent).toEqual([{ type: 'subscribe', systemIds: ['van-1'] }]);
  });

  it('caps the back-off at 30 seconds', () => {
    expect([0, 1, 2, 10].map(reconnectDelay)).toEqual([1000, 2000, 4000, 30000]);
  });
});
