/**
 * The HTML report as a browser shows it: written by `ionwright report` for the demo notes, opened from disk
 * in headless Chromium in light and dark system themes. The chart and the tables must render, and the page
 * must ask for nothing over the network. Screenshots: test-output/report-light.png, report-dark.png.
 */
import { spawnSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { contrast, HAVE_BROWSER, launch, outputPath, REQUIRE_BROWSER } from '../browser';

const ROOT = join(__dirname, '../..');

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

describe.runIf(HAVE_BROWSER || REQUIRE_BROWSER)('the report as a weighing sheet: print media in headless Chromium', () => {
  let browser: Browser;
  const file = outputPath('report-enl.html');
  beforeAll(async () => {
    // An invented electroless-nickel line, one batch incomplete.
    const note = outputPath('enl-note.md');
    writeFileSync(
      note,
      '# EN-2 (invented)\n\n```batch\nname: EN-2 make-up\nvolume: 1 L\nNiSO4·6H2O 240 g\nNaH2PO2·H2O 30 g\nNH3 to pH 4.8\n```\n\n```batch\nname: Pickle P-1\nvolume: 10 L\nH2SO4 0.5 M\n```\n',
    );
    const r = spawnSync(process.execPath, [join(ROOT, 'dist/cli.js'), 'report', note, '--html', file], { cwd: ROOT, encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(1);
    browser = await launch();
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
  });

  it('leads with the batches, the incomplete one in the error colour on screen', async () => {
    const page = await browser.newPage({ colorScheme: 'light', viewport: { width: 1100, height: 900 } });
    try {
      await page.goto(pathToFileURL(file).href);
      const order = await page.evaluate(() => [...document.querySelectorAll('h2')].map((h) => h.id));
      expect(order.slice(0, 2)).toEqual(['batches', 'cautions']);
      expect(order.indexOf('findings')).toBeLessThan(order.indexOf('formulas'));
      const c = await page.evaluate(() => {
        const fig = document.querySelector('figure.iw-batch-incomplete') as Element;
        const word = fig.querySelector('.iw-incomplete') as Element;
        return { edge: getComputedStyle(fig).borderLeftColor, word: getComputedStyle(word).color, bg: getComputedStyle(document.body).backgroundColor };
      });
      expect(c.edge).toBe(c.word);
      expect(contrast(c.word, c.bg)).toBeGreaterThanOrEqual(4.5);
      // The "Weighed" column is for paper only.
      expect(await page.locator('th.iw-weighed').first().isVisible()).toBe(false);
    } finally {
      await page.close();
    }
  }, 60_000);

  it('prints black on white with bordered tables, a Weighed column, no widgets, and no batch split across pages', async () => {
    const page = await browser.newPage({ viewport: { width: 800, height: 1100 } });
    try {
      await page.goto(pathToFileURL(file).href);
      await page.emulateMedia({ media: 'print', colorScheme: 'dark' });
      const p = await page.evaluate(() => {
        const cs = (sel: string) => getComputedStyle(document.querySelector(sel) as Element);
        const td = cs('figure.iw-batch table.iw-table td');
        return {
          text: cs('body').color,
          bg: cs('body').backgroundColor,
          border: `${td.borderTopStyle} ${td.borderTopColor}`,
          breakInside: cs('figure.iw-batch').breakInside,
          weighed: cs('th.iw-weighed').display,
          widgets: [...document.querySelectorAll('details, nav')].filter((e) => getComputedStyle(e).display !== 'none').length,
          incomplete: cs('.iw-incomplete').color,
        };
      });
      expect(p.text).toBe('rgb(0, 0, 0)');
      expect(p.bg).toBe('rgb(255, 255, 255)');
      expect(p.border).toBe('solid rgb(0, 0, 0)');
      expect(p.breakInside).toBe('avoid');
      expect(p.weighed).toBe('table-cell');
      expect(p.widgets).toBe(0);
      expect(p.incomplete).toBe('rgb(0, 0, 0)');
      await page.screenshot({ path: outputPath('report-print.png'), fullPage: true });
      const pdf = await page.pdf({ format: 'A4' });
      expect(pdf.length).toBeGreaterThan(1000);
    } finally {
      await page.close();
    }
  }, 60_000);
});

describe.skipIf(HAVE_BROWSER || REQUIRE_BROWSER)('the HTML report in headless Chromium', () => {
  it.skip('needs /usr/bin/chromium (Debian package chromium); .ci/run installs it', () => {});
});
