import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { Subject } from 'rxjs';
import type { WebSocketSubjectConfig } from 'rxjs/webSocket';
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

  it('caps the back-off at 30 seconds', () => {
    expect([0, 1, 2, 10].map(reconnectDelay)).toEqual([1000, 2000, 4000, 30000]);
  });
});
