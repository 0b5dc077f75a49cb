/**
 * Opens the rendered report in headless Chromium (Debian's package, driven by playwright-core)
 * and checks what a reader gets: no console errors, no network request besides the file itself,
 * every figure drawn with a non-zero size, no script from the data. Saves a screenshot of the
 * first screen to test/.tmp/report.png.
 *
 * Skips only when /usr/bin/chromium is missing AND the CI variable is unset; in CI it must run.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { chromium } from 'playwright-core';
import type { BrowserContext, Page } from 'playwright-core';
import { renderReport } from '../../src/report/index.ts';
import { buildInput, hostileInput, HOSTILE_SCRIPT } from './fixture.ts';

const CHROMIUM = '/usr/bin/chromium';
const FLAGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];
const haveChromium = existsSync(CHROMIUM);
const inCi = Boolean(process.env.CI);
const OUT_DIR = fileURLToPath(new URL('../.tmp/', import.meta.url));

if (!haveChromium && !inCi) {
  console.warn(`browser test skipped: ${CHROMIUM} not found (install Debian's chromium: apt-get install -y chromium). In CI (CI set) it runs and fails instead.`);
}

interface Visit {
  page: Page;
  requests: string[];
  consoleErrors: string[];
  dialogs: string[];
}

describe.skipIf(!haveChromium && !inCi)('report in headless Chromium', () => {
  let context: BrowserContext;
  let profile: string;

  beforeAll(async () => {
    profile = mkdtempSync(join(tmpdir(), 'patternfold-chromium-'));
    context = await chromium.launchPersistentContext(profile, {
      executablePath: CHROMIUM,
      headless: true,
      args: FLAGS,
      viewport: { width: 1280, height: 900 },
      offline: false,
    });
  }, 60_000);

  afterAll(async () => {
    await context?.close();
    if (profile) rmSync(profile, { recursive: true, force: true });
  });

  async function visit(html: string, name: string): Promise<Visit & { url: string }> {
    mkdirSync(OUT_DIR, { recursive: true });
    const file = join(OUT_DIR, name);
    writeFileSync(file, html);
    const url = pathToFileURL(file).href;
    const page = await context.newPage();
    const v: Visit = { page, requests: [], consoleErrors: [], dialogs: [] };
    page.on('request', (r) => v.requests.push(r.url()));
    page.on('console', (m) => {
      if (m.type() === 'error') v.consoleErrors.push(m.text());
    });
    page.on('pageerror', (e) => v.consoleErrors.push(String(e)));
    page.on('dialog', async (d) => {
      v.dialogs.push(d.message());
      await d.dismiss();
    });
    await page.goto(url, { waitUntil: 'load' });
    return { ...v, url };
  }

  it('shows the demo report offline: no console error, no request but the file, every figure drawn', async () => {
    const v = await visit(await renderReport(buildInput()), 'report.html');
    expect(v.consoleErrors).toEqual([]);
    expect(v.requests).toEqual([v.url]);
    const boxes = await v.page.$$eval('figure.plot > svg', (svgs) =>
      svgs.map((s) => {
        const r = s.getBoundingClientRect();
        return { figure: s.parentElement?.getAttribute('data-figure') ?? '?', width: r.width, height: r.height };
      }),
    );
    expect(boxes.length).toBe(15);
    for (const b of boxes) {
      expect(b.width, b.figure).toBeGreaterThan(0);
      expect(b.height, b.figure).toBeGreaterThan(0);
    }
    // every svg on the page, nested ones included, has a rendered size
    const empty = await v.page.$$eval('svg', (svgs) => svgs.filter((s) => { const r = s.getBoundingClientRect(); return !(r.width > 0 && r.height > 0); }).length);
    expect(empty).toBe(0);
    const heading = await v.page.textContent('#answer h2');
    expect(heading).toBe('The answer');
    await v.page.screenshot({ path: join(OUT_DIR, 'report.png') });
    await v.page.close();
  });

  it('runs nothing from hostile names and shows them as text', async () => {
    const v = await visit(await renderReport(hostileInput()), 'report-hostile.html');
    expect(v.dialogs).toEqual([]);
    expect(v.consoleErrors).toEqual([]);
    expect(v.requests).toEqual([v.url]);
    expect(await v.page.locator('script').count()).toBe(0);
    expect(await v.page.locator('img, iframe, object, embed').count()).toBe(0);
    const title = await v.page.textContent('h1');
    expect(title).toContain(HOSTILE_SCRIPT);
    const legendText = await v.page.$$eval('figure[data-figure="pca"] svg text', (ts) => ts.map((t) => t.textContent ?? ''));
    expect(legendText).toContain(HOSTILE_SCRIPT);
    const bodyText = await v.page.locator('body').innerText();
    expect(bodyText).not.toContain('\u202E');
    await v.page.close();
  });
});
