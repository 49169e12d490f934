import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ReceivedReading } from '@cellwarden/shared';
import { Subject } from 'rxjs';
import type { WebSocketSubjectConfig } from 'rxjs/webSocket';
import { LiveHeadStart } from './live-head-start';
import { WEB_SOCKET_FACTORY, type SystemStreamEvent } from './live-stream';
import { OfflineStore } from './offline/offline-store';
import {
  STATUS_HEAD_START,
  SYSTEM_HEAD_START,
  type StatusHeadStartAnswer,
  type SystemHeadStartAnswer,
} from './session-head-start';

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

const reading = (measuredAt: number): ReceivedReading => ({
  measuredAt,
  receivedAt: measuredAt,
  voltage: 13.1,
  current: 2,
  temperature: 9,
});
const STATUS = {
  systemId: 'van-1',
  latestReading: reading(1000),
  derived: null,
  activeAlerts: [],
  monitors: [],
};

describe('LiveHeadStart', () => {
  let sockets: FakeSocket[];
  let http: HttpTestingController;
  let headStart: LiveHeadStart;
  // The status request the page's script sent before the app ran, per system (none unless a test sets one).
  let early: Record<string, Promise<StatusHeadStartAnswer>>;
  // The same for the system's description.
  let earlySystem: Record<string, Promise<SystemHeadStartAnswer>>;

  beforeEach(() => {
    early = {};
    earlySystem = {};
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
        {
          provide: STATUS_HEAD_START,
          useValue: (systemId: string) => {
            const started = early[systemId] ?? null;
            delete early[systemId];
            return started;
          },
        },
        {
          provide: SYSTEM_HEAD_START,
          useValue: (systemId: string) => {
            const started = earlySystem[systemId] ?? null;
            delete earlySystem[systemId];
            return started;
          },
        },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    headStart = TestBed.inject(LiveHeadStart);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  it('asks for the status once: the view takes over the answer already on its way', () => {
    headStart.start('van-1');
    const request = http.expectOne('/api/systems/van-1/status');
    const seen: unknown[] = [];
    headStart.status('van-1').subscribe((s) => seen.push(s));
    request.flush({ status: STATUS });
    expect(seen).toEqual([STATUS]);
    // Taken once: a later view (a reload of its data) asks the server again.
    headStart.status('van-1').subscribe();
    http.expectOne('/api/systems/van-1/status').flush({ status: STATUS });
  });

  it('opens the socket at once and hands the view the events that came early, then the live ones', () => {
    headStart.start('van-1');
    http.expectOne('/api/systems/van-1/status').flush({ status: STATUS });
    expect(sockets).toHaveLength(1);
    sockets[0].open();
    sockets[0].receive({ type: 'reading', systemId: 'van-1', reading: reading(2000) });

    const events: SystemStreamEvent[] = [];
    headStart.status('van-1').subscribe();
    headStart.events('van-1').subscribe((e) => events.push(e));
    sockets[0].receive({ type: 'reading', systemId: 'van-1', reading: reading(3000) });

    expect(events.map((e) => e.type === 'reading' && e.reading.measuredAt)).toEqual([2000, 3000]);
    // The hand-over never told the server to stop sending this system's readings, and kept the one socket.
    expect(sockets[0].sent).not.toContainEqual(expect.objectContaining({ type: 'unsubscribe' }));
    expect(sockets).toHaveLength(1);
  });

  it('asks afresh for another system than the one it started for', () => {
    headStart.start('van-1');
    http.expectOne('/api/systems/van-1/status').flush({ status: STATUS });
    headStart.status('van-2').subscribe();
    http.expectOne('/api/systems/van-2/status').flush({ status: { ...STATUS, systemId: 'van-2' } });
  });

  it('lets go of the stream when no view takes it over', () => {
    headStart.start('van-1');
    http.expectOne('/api/systems/van-1/status').flush({ status: STATUS });
    sockets[0].open();
    jest.advanceTimersByTime(9_000);
    expect(sockets[0].observed).toBe(true);
    // Nobody else watches: the socket closes.
    jest.advanceTimersByTime(1_000);
    expect(sockets[0].observed).toBe(false);
  });

  it('takes over the status the page asked for before the app ran, and keeps it for offline use', async () => {
    early['van-1'] = Promise.resolve({ status: 200, body: { status: STATUS } });
    const kept = jest.spyOn(TestBed.inject(OfflineStore), 'recordStatus');
    headStart.start('van-1');
    http.expectNone('/api/systems/van-1/status');
    const seen: unknown[] = [];
    headStart.status('van-1').subscribe((s) => seen.push(s));
    await Promise.resolve();
    await Promise.resolve();
    expect(seen).toEqual([STATUS]);
    expect(kept).toHaveBeenCalledWith(STATUS);
  });

  it("asks the usual way when the page's own status request failed", async () => {
    early['van-1'] = Promise.resolve({ status: 401, body: null });
    headStart.start('van-1');
    await Promise.resolve();
    await Promise.resolve();
    const seen: unknown[] = [];
    headStart.status('van-1').subscribe((s) => seen.push(s));
    http.expectOne('/api/systems/van-1/status').flush({ status: STATUS });
    expect(seen).toEqual([STATUS]);
  });

  describe("the system's description", () => {
    const SUMMARY = { id: 'van-1', name: 'Winter van', chemistry: 'lifepo4' };

    it('takes over the one the page asked for before the app ran, once', async () => {
      earlySystem['van-1'] = Promise.resolve({ status: 200, body: { system: SUMMARY as never } });
      const seen: unknown[] = [];
      headStart.system('van-1').subscribe((s) => seen.push(s));
      await Promise.resolve();
      await Promise.resolve();
      http.expectNone('/api/systems/van-1');
      expect(seen).toEqual([SUMMARY]);
      // A later view asks the server itself.
      headStart.system('van-1').subscribe();
      http.expectOne('/api/systems/van-1').flush({ system: SUMMARY });
    });

    it("asks the usual way when the page's own request failed, or was for another system", async () => {
      earlySystem['van-1'] = Promise.resolve({ status: 0, body: null });
      const seen: unknown[] = [];
      headStart.system('van-1').subscribe((s) => seen.push(s));
      await Promise.resolve();
      await Promise.resolve();
      http.expectOne('/api/systems/van-1').flush({ system: SUMMARY });
      expect(seen).toEqual([SUMMARY]);

      earlySystem['van-1'] = Promise.resolve({ status: 200, body: { system: SUMMARY as never } });
      headStart.system('van-2').subscribe();
      http.expectOne('/api/systems/van-2').flush({ system: { ...SUMMARY, id: 'van-2' } });
    });
  });
});
