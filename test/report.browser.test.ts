/**
 * The HTML report as a browser shows it: written by `ionwright report` for the demo notes, opened from disk
 * in headless Chromium in light and dark system themes. The chart and the tables must render, and the page
 * must ask for nothing over the network. Screenshots: test-output/report-light.png, report-dark.png.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { contrast, HAVE_BROWSER, launch, outputPath, REQUIRE_BROWSER } from './browser';

const ROOT = join(__dirname, '..');

describe.runIf(HAVE_BROWSER || REQUIRE_BROWSER)('the HTML report in headless Chromium', () => {
  let browser: Browser;
  const file = outputPath('report.html');
  beforeAll(async () => {
    // npm test has built dist/cli.js; the report is written exactly as a user would write it.
    // (exit 1: the demo note has an error-severity finding on purpose)
    const r = spawnSync(process.execPath, [join(ROOT, 'dist/cli.js'), 'report', 'examples/rinse-trials.md', '--html', file], { cwd: ROOT, encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(1);
    browser = await launch();
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
  });

  for (const scheme of ['light', 'dark'] as const) {
    it(`renders the chart and the tables (${scheme})`, async () => {
      const page = await browser.newPage({ colorScheme: scheme, viewport: { width: 1100, height: 900 } });
      const requests: string[] = [];
      page.on('request', (r) => requests.push(r.url()));
      try {
        await page.goto(pathToFileURL(file).href);
        // Nothing but the page itself is fetched.
        expect(requests).toEqual([pathToFileURL(file).href]);

        const chart = page.locator('figure.iw-chart svg').first();
        const box = (await chart.boundingBox())!;
        expect(box.width).toBeGreaterThan(400);
        expect(box.height).toBeGreaterThan(200);
        // One marker per charted salt, each with a formula label drawn inside the chart.
        const labels = await chart.locator('text').allTextContents();
        expect(labels).toContain('NaCl');
        const markers = await chart.evaluate((svg) => [...svg.querySelectorAll('title')].filter((t) => /kJ\/mol/.test(t.textContent ?? '')).length);
        expect(markers).toBeGreaterThanOrEqual(3);
        // Chart text follows the page's text colour, legible on the page background.
        const c = await page.evaluate(() => {
          const t = document.querySelector('figure.iw-chart svg text') as Element;
          return { text: getComputedStyle(t).fill, bg: getComputedStyle(document.body).backgroundColor };
        });
        expect(contrast(c.text, c.bg)).toBeGreaterThanOrEqual(4.5);

        // The tables are laid out and hold numbers.
        const formulas = page.locator('#formulas + table');
        expect(await formulas.isVisible()).toBe(true);
        expect(await formulas.locator('tbody tr').count()).toBeGreaterThanOrEqual(5);
        expect(await page.locator('#batches ~ figure.iw-batch').count()).toBe(2);
        expect(await page.locator('table.iw-findings-table tbody tr').count()).toBeGreaterThan(0);

        await page.screenshot({ path: outputPath(`report-${scheme}.png`), fullPage: true });
      } finally {
        await page.close();
      }
    }, 60_000);
  }
});

describe.skipIf(HAVE_BROWSER || REQUIRE_BROWSER)('the HTML report in headless Chromium', () => {
  it.skip('needs /usr/bin/chromium (Debian package chromium); .ci/run installs it', () => {});
});
