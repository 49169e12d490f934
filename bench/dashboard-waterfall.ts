import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { CDPSession, Page } from 'playwright-core';

/** One line of a visit's waterfall: ms from navigation to its start and its end. */
export interface WaterfallRow {
  what: string;
  startMs: number;
  endMs: number | null;
}

// Marks the dashboard sets on itself (web/src/main.ts): its code has run, and bootstrap has finished.
const PAGE_MARKS = ['cw:main-start', 'cw:bootstrapped'];
// Each selector is watched from inside the page so its instant is exact: the first live value (the head-start
// script's first glance or the live view's tiles, whichever shows first) and the live view complete (its tiles).
const FIRST_VALUE_WATCH = (marks: Record<string, string>) => `
  for (const [name, selector] of Object.entries(${JSON.stringify(marks)}))
    new MutationObserver((_m, observer) => {
      if (!document.querySelector(selector)) return;
      performance.mark(name);
      observer.disconnect();
    }).observe(document, { childList: true, subtree: true, characterData: true });
  // Stretches of at least 50 ms when the page's main thread ran script, layout or paint without a break.
  new PerformanceObserver((list) => {
    for (const task of list.getEntries()) performance.mark('cw:long-task', { startTime: task.startTime, detail: task.duration });
  }).observe({ type: 'longtask', buffered: true });`;

/**
 * Records, for one visit, every request's start and end (Chrome DevTools Protocol network events, ms after the
 * document's own request) with the WebSocket's handshake and first reading, and the page's own marks. Call
 * before navigating; `rows()` after the first value is on screen.
 */
export async function recordWaterfall(
  page: Page,
  cdp: CDPSession,
  selectors: { firstValue: string; complete?: string },
) {
  const watched: Record<string, string> = { 'cw:first-value': selectors.firstValue };
  if (selectors.complete) watched['cw:live-view-complete'] = selectors.complete;
  await page.addInitScript(FIRST_VALUE_WATCH(watched));
  const started = new Map<string, { url: string; at: number }>();
  const ended = new Map<string, number>();
  const socket: { created?: number; open?: number; subscribeSent?: number; firstReading?: number } = {};
  let origin: number | null = null;
  cdp.on('Network.requestWillBeSent', (e) => {
    origin ??= e.timestamp;
    if (!started.has(e.requestId)) started.set(e.requestId, { url: e.request.url, at: e.timestamp });
  });
  cdp.on('Network.loadingFinished', (e) => ended.set(e.requestId, e.timestamp));
  cdp.on('Network.loadingFailed', (e) => ended.set(e.requestId, e.timestamp));
  cdp.on('Network.webSocketWillSendHandshakeRequest', (e) => (socket.created ??= e.timestamp));
  cdp.on('Network.webSocketHandshakeResponseReceived', (e) => (socket.open ??= e.timestamp));
  cdp.on('Network.webSocketFrameSent', (e) => {
    if (e.response.payloadData.includes('"subscribe"')) socket.subscribeSent ??= e.timestamp;
  });
  cdp.on('Network.webSocketFrameReceived', (e) => {
    if (e.response.payloadData.includes('"reading"')) socket.firstReading ??= e.timestamp;
  });

  // CW_BENCH_PAGE_PROFILE=folder also keeps a CPU profile of the page per visit, to see what its long tasks ran.
  const profileDir = process.env.CW_BENCH_PAGE_PROFILE;
  if (profileDir) {
    await cdp.send('Profiler.enable');
    await cdp.send('Profiler.setSamplingInterval', { interval: 200 });
    await cdp.send('Profiler.start');
  }

  return {
    async rows(): Promise<WaterfallRow[]> {
      if (profileDir) {
        const { profile } = await cdp.send('Profiler.stop');
        mkdirSync(profileDir, { recursive: true });
        writeFileSync(
          join(profileDir, `page-${Date.now()}-origin-${origin ?? 0}.cpuprofile`),
          JSON.stringify(profile),
        );
      }
      const base = origin ?? 0;
      const ms = (t: number | undefined) => (t === undefined ? null : (t - base) * 1000);
      const rows: WaterfallRow[] = [...started].map(([id, { url, at }]) => ({
        what: shortName(url),
        startMs: ms(at)!,
        endMs: ms(ended.get(id)),
      }));
      if (socket.created !== undefined) {
        rows.push({ what: 'WebSocket handshake', startMs: ms(socket.created)!, endMs: ms(socket.open) });
        if (socket.subscribeSent !== undefined)
          rows.push({
            what: 'WebSocket subscribe → first reading',
            startMs: ms(socket.subscribeSent)!,
            endMs: ms(socket.firstReading),
          });
      }
      // The page's marks count from its time origin, which is the document's request start.
      const marks = (await page.evaluate(
        (names) =>
          performance
            .getEntriesByType('mark')
            .filter((m) => names.includes(m.name))
            .map((m) => ({
              name: m.name,
              at: m.startTime,
              ms: (m as PerformanceMark).detail as number | null,
            })),
        [...PAGE_MARKS, 'cw:first-value', 'cw:live-view-complete', 'cw:long-task'],
      )) as { name: string; at: number; ms: number | null }[];
      for (const mark of marks)
        rows.push(
          mark.name === 'cw:long-task'
            ? { what: 'main thread busy (long task)', startMs: mark.at, endMs: mark.at + (mark.ms ?? 0) }
            : { what: `mark ${mark.name}`, startMs: mark.at, endMs: null },
        );
      return rows.sort((a, b) => a.startMs - b.startMs);
    },
  };
}

/** The waterfall as lines of text: start and end, ms after navigation. */
export function formatWaterfall(rows: WaterfallRow[]): string {
  return rows
    .map(
      (r) =>
        `${r.startMs.toFixed(0).padStart(6)} → ${(r.endMs === null ? '' : r.endMs.toFixed(0)).padStart(6)} ms  ${r.what}`,
    )
    .join('\n');
}

function shortName(url: string): string {
  const { pathname, search } = new URL(url);
  return `${pathname}${search}`.slice(0, 70);
}
