import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { connectAsync } from 'mqtt';
import { encodeReadingPack, readingsTopic } from '@cellwarden/shared';
import { launchChromium } from '../test/browser/launch-chromium';
import { formatWaterfall, recordWaterfall } from './dashboard-waterfall';
import type { Monitor } from './product-node';

// The first live value on screen is whichever shows first: a value of the first glance the head-start script
// paints from the status before Angular runs, or a value of the live view's own tiles. The live view is
// complete once its tiles show values (the first glance is gone by then).
const FIRST_GLANCE_VALUE = '#cw-first-glance .cw-first-glance-value';
const LIVE_VIEW_VALUE = '.tiles .tile dd';

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/** A page with nothing but one WebSocket: the floor for "first live value on screen". */
const barePage = (
  streamUrl: string,
  token: string,
  systemId: string,
) => `<!doctype html><html lang="en"><title>bare</title>
<p id="value"></p><script>
const socket = new WebSocket('${streamUrl}', ['cellwarden.v1', 'bearer.${token}']);
socket.onopen = () => socket.send(JSON.stringify({ type: 'subscribe', systemIds: ['${systemId}'] }));
socket.onmessage = (event) => {
  const message = JSON.parse(event.data);
  if (message.type === 'reading') document.getElementById('value').textContent = message.reading.voltage + ' V';
};
</script></html>`;

/**
 * Bytes a first visit downloads (cold cache) and the time from navigation to the first live value on screen,
 * for the dashboard's live view and for a bare page, while the monitor reports ten times a second.
 */
export async function timeDashboard(options: {
  baseUrl: string;
  token: string;
  mqttUrl: string;
  monitor: Monitor;
  runs: number;
}) {
  const { baseUrl, monitor } = options;
  const device = await connectAsync(options.mqttUrl, {
    username: monitor.deviceId,
    password: monitor.secret,
    clientId: monitor.deviceId,
  });
  let k = 0;
  const start = Date.now() - 120_000;
  const ticker = setInterval(() => {
    const reading = { measuredAt: start + k++ * 100, voltage: 13.1, current: 2, temperature: 9 };
    void device
      .publishAsync(
        readingsTopic(monitor.deviceId),
        JSON.stringify(encodeReadingPack(monitor.deviceId, [reading])),
        { qos: 1 },
      )
      .catch(() => undefined);
  }, 100);
  // The bare page comes from a server of its own on loopback (a page the browser made up would count as
  // public, and Chromium's local network access checks would refuse its socket to 127.0.0.1).
  const streamUrl = `${baseUrl.replace('http', 'ws')}/api/stream`;
  const bareServer = createServer((_req, res) =>
    res
      .writeHead(200, { 'content-type': 'text/html' })
      .end(barePage(streamUrl, options.token, monitor.systemId)),
  );
  await new Promise<void>((resolve) => bareServer.listen(0, '127.0.0.1', resolve));
  const bareUrl = `http://127.0.0.1:${(bareServer.address() as AddressInfo).port}/`;
  const chromium = await launchChromium();
  try {
    const visit = async (
      path: string,
      selectors: { firstValue: string; complete?: string },
      bare: boolean,
    ) => {
      const context = await chromium.browser.newContext();
      const page = await context.newPage();
      if (!bare) {
        const signIn = await page.request.post(`${baseUrl}/api/auth/sign-in`, {
          data: { email: 'ilse.varga@owner.example', password: 'cellwarden-demo' },
        });
        if (!signIn.ok()) throw new Error(`dashboard sign-in answered ${signIn.status()}`);
      }
      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.enable');
      const waterfall = await recordWaterfall(page, cdp, selectors);
      let bytes = 0;
      let scriptBytes = 0;
      const scripts = new Set<string>();
      cdp.on('Network.responseReceived', (e) => {
        if (e.type === 'Script') scripts.add(e.requestId);
      });
      cdp.on('Network.loadingFinished', (e) => {
        bytes += e.encodedDataLength;
        if (scripts.has(e.requestId)) scriptBytes += e.encodedDataLength;
      });
      const started = performance.now();
      await page.goto(bare ? path : `${baseUrl}${path}`);
      await page.locator(selectors.firstValue).first().waitFor({ state: 'visible', timeout: 30_000 });
      const firstValueMs = performance.now() - started;
      if (selectors.complete)
        await page.locator(selectors.complete).first().waitFor({ state: 'visible', timeout: 30_000 });
      const completeMs = performance.now() - started;
      await page.waitForLoadState('networkidle').catch(() => undefined);
      const rows = await waterfall.rows();
      await context.close();
      // The instant the value entered the page, by the page's own clock (a MutationObserver): the locator above
      // notices it only when it next checks, 100-300 ms later in these runs, and later still when the page's
      // main thread is busy.
      const inPageMs = rows.find((r) => r.what === 'mark cw:first-value')?.startMs ?? NaN;
      const completeInPageMs = rows.find((r) => r.what === 'mark cw:live-view-complete')?.startMs ?? NaN;
      return { firstValueMs, inPageMs, completeMs, completeInPageMs, bytes, scriptBytes, rows };
    };
    const dashboard = [];
    const bare = [];
    for (let i = 0; i < options.runs; i++) {
      dashboard.push(
        await visit(
          `/systems/${monitor.systemId}`,
          { firstValue: `${FIRST_GLANCE_VALUE}, ${LIVE_VIEW_VALUE}`, complete: LIVE_VIEW_VALUE },
          false,
        ),
      );
      bare.push(await visit(bareUrl, { firstValue: '#value:not(:empty)' }, true));
    }
    // Where the time goes, for the visit that took the median time of each kind.
    for (const [name, visits] of [
      ['dashboard', dashboard],
      ['bare page', bare],
    ] as const) {
      const middle = visits.find((v) => v.firstValueMs === median(visits.map((d) => d.firstValueMs)))!;
      console.log(`${name} visit, ${middle.firstValueMs.toFixed(0)} ms to the first value:`);
      console.log(formatWaterfall(middle.rows));
    }
    return {
      dashboardMs: median(dashboard.map((d) => d.firstValueMs)),
      bareMs: median(bare.map((d) => d.firstValueMs)),
      dashboardInPageMs: median(dashboard.map((d) => d.inPageMs)),
      completeMs: median(dashboard.map((d) => d.completeMs)),
      completeInPageMs: median(dashboard.map((d) => d.completeInPageMs)),
      bareInPageMs: median(bare.map((d) => d.inPageMs)),
      dashboardBytes: median(dashboard.map((d) => d.bytes)),
      dashboardScriptBytes: median(dashboard.map((d) => d.scriptBytes)),
    };
  } finally {
    clearInterval(ticker);
    await chromium.close();
    bareServer.close();
    await device.endAsync();
  }
}
