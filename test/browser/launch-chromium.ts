import { chromium, type Browser } from 'playwright-core';

/**
 * Debian's Chromium, headless, with no background traffic. playwright-core gives every launch a
 * fresh, throwaway profile folder of its own.
 */
export async function launchChromium(): Promise<{ browser: Browser; close(): Promise<void> }> {
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
    ],
  });
  return { browser, close: () => browser.close() };
}
