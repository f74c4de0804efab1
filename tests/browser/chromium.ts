/**
 * The real browser for the browser suite: Debian's Chromium driven by playwright-core, one
 * browser and one page per test file, and a guard on that page that records everything a
 * printed card must not do: ask for anything that is not a local file, fail a request, log
 * a console error, throw, or open a dialog.
 *
 * Where no Chromium is installed the suite is skipped with a notice, except under CI=true,
 * where a missing browser is a failing test (.ci/run installs it).
 */
import { existsSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';

/**
 * Where Chromium is looked for: the usual Debian paths, or only STOVECARD_CHROMIUM when it
 * is set (STOVECARD_CHROMIUM=/nowhere shows what a machine without a browser does).
 */
export const CHROMIUM_CANDIDATES: readonly string[] = process.env.STOVECARD_CHROMIUM
  ? [process.env.STOVECARD_CHROMIUM]
  : ['/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome'];

export const CHROMIUM: string | undefined = CHROMIUM_CANDIDATES.find((p) => existsSync(p));

/** Headless, no sandbox (containers), nothing phoning home: the print checks run offline. */
export const CHROMIUM_ARGS: readonly string[] = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

const IN_CI = process.env.CI === 'true' || process.env.CI === '1';

export const MISSING_CHROMIUM = `Chromium not found at ${CHROMIUM_CANDIDATES.join(', ')}; .ci/run installs Debian's chromium`;

/**
 * describe(name, body) when Chromium is there. Without it: a failing test under CI=true, a
 * skipped suite whose name says why (and a console warning) elsewhere.
 */
export function describeWithBrowser(name: string, body: () => void): void {
  if (CHROMIUM) {
    describe(name, body);
  } else if (IN_CI) {
    describe(name, () => {
      it('has a Chromium to run in', () => {
        expect.fail(MISSING_CHROMIUM);
      });
    });
  } else {
    console.warn(`stovecard browser suite "${name}" skipped: ${MISSING_CHROMIUM}`);
    describe.skip(`${name} (skipped: ${MISSING_CHROMIUM})`, body);
  }
}

/** What the guard saw since the last reset. */
export interface PageTrouble {
  /** URLs that were not file:// or data:, each once (each was aborted before it left the machine). */
  readonly network: string[];
  /** `url: failure text` of requests that failed (aborted network requests included). */
  readonly failedRequests: string[];
  readonly consoleErrors: string[];
  readonly pageErrors: string[];
  /** `type: message` of alert/confirm/prompt/beforeunload dialogs (each dismissed). */
  readonly dialogs: string[];
}

export interface GuardedPage {
  readonly browser: Browser;
  readonly context: BrowserContext;
  readonly page: Page;
  /** Forget what was seen (call before each navigation). */
  reset(): void;
  readonly trouble: PageTrouble;
  /** Fails when anything was seen since the last reset, naming `what` and listing it all. */
  expectNoTrouble(what: string): void;
  close(): Promise<void>;
}

const LOCAL = new Set(['file:', 'data:', 'about:']);

/** Launches Chromium and opens one guarded page (print media unless `media` says otherwise). */
export async function openGuardedPage(
  options: { media?: 'print' | 'screen'; viewport?: { width: number; height: number } } = {},
): Promise<GuardedPage> {
  if (!CHROMIUM) throw new Error(MISSING_CHROMIUM);
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: [...CHROMIUM_ARGS],
  });
  const context = await browser.newContext({
    serviceWorkers: 'block',
    deviceScaleFactor: 1,
    ...(options.viewport ? { viewport: options.viewport } : {}),
  });
  const trouble = {
    network: [] as string[],
    failedRequests: [] as string[],
    consoleErrors: [] as string[],
    pageErrors: [] as string[],
    dialogs: [] as string[],
  };
  // Everything that is not a local file is stopped here and counted as a failure.
  await context.route(
    (url) => !LOCAL.has(url.protocol),
    async (route) => {
      const url = route.request().url();
      if (!trouble.network.includes(url)) trouble.network.push(url);
      await route.abort('blockedbyclient');
    },
  );
  const page = await context.newPage();
  page.on('request', (request) => {
    const protocol = new URL(request.url()).protocol;
    if (!LOCAL.has(protocol) && !trouble.network.includes(request.url()))
      trouble.network.push(request.url());
  });
  page.on('requestfailed', (request) =>
    trouble.failedRequests.push(`${request.url()}: ${request.failure()?.errorText ?? 'failed'}`),
  );
  page.on('response', (response) => {
    if (response.status() >= 400)
      trouble.failedRequests.push(`${response.url()}: HTTP ${response.status()}`);
  });
  page.on('console', (message) => {
    if (message.type() === 'error') trouble.consoleErrors.push(message.text());
  });
  page.on('pageerror', (error) => trouble.pageErrors.push(error.message));
  page.on('dialog', async (dialog) => {
    trouble.dialogs.push(`${dialog.type()}: ${dialog.message()}`);
    await dialog.dismiss();
  });
  await page.emulateMedia({ media: options.media ?? 'print' });

  const reset = () => {
    for (const list of Object.values(trouble)) list.length = 0;
  };
  return {
    browser,
    context,
    page,
    trouble,
    reset,
    expectNoTrouble(what: string) {
      const seen = Object.entries(trouble).filter(([, list]) => list.length > 0);
      const report = seen.map(([kind, list]) => `${kind}:\n  ${list.join('\n  ')}`).join('\n');
      expect(seen.length, `${what}:\n${report}`).toBe(0);
    },
    async close() {
      await browser.close();
    },
  };
}

/** Opens a local file and waits until its fonts are in (layout is final after that). */
export async function openFile(guarded: GuardedPage, file: string): Promise<void> {
  guarded.reset();
  await guarded.page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
  await guarded.page.evaluate(async () => {
    await document.fonts.ready;
  });
}
