/**
 * The preview as a browser shows it: the fixture note rendered by markdown-it with the plugin and the
 * preview styles, opened in headless Chromium under VS Code's light, dark and high-contrast theme variables.
 * Screenshots go to test-output/preview-<theme>.png.
 */
import MarkdownIt from 'markdown-it';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ionwrightPreview } from '../../server/src/service/preview';
import { contrast, HAVE_BROWSER, launch, outputPath, previewPage, REQUIRE_BROWSER, VSCODE_THEMES, type ThemeName } from '../browser';

const NOTE = readFileSync(join(__dirname, '../fixtures/preview-note.md'), 'utf8');
const CSS = readFileSync(join(__dirname, '../../media/preview.css'), 'utf8');
const html = new MarkdownIt().use(ionwrightPreview).render(NOTE);

describe.runIf(HAVE_BROWSER || REQUIRE_BROWSER)('the preview in headless Chromium', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launch();
  }, 60_000);
  afterAll(async () => {
    await browser?.close();
  });

  async function open(theme: ThemeName): Promise<Page> {
    const page = await browser.newPage({ viewport: { width: 960, height: 900 } });
    await page.setContent(previewPage(html, CSS, theme));
    return page;
  }

  for (const theme of Object.keys(VSCODE_THEMES) as ThemeName[]) {
    it(`renders in the ${theme} theme: typeset formulas, the batch table, legible colours`, async () => {
      const page = await open(theme);
      try {
        // Subscripts are smaller than the text around them and sit below its baseline.
        const sub = await page.evaluate(() => {
          const s = document.querySelector('.iw-formula sub') as HTMLElement;
          const p = s.parentElement as HTMLElement;
          return {
            sub: parseFloat(getComputedStyle(s).fontSize),
            parent: parseFloat(getComputedStyle(p).fontSize),
            dy: s.getBoundingClientRect().bottom - p.getBoundingClientRect().bottom,
          };
        });
        expect(sub.sub).toBeLessThan(sub.parent);
        expect(sub.dy).toBeGreaterThan(0);

        // The batch table is laid out with its numbers, right-aligned, and fits the page.
        const table = page.locator('figure.iw-batch table.iw-table').first();
        expect(await table.isVisible()).toBe(true);
        const box = (await table.boundingBox())!;
        expect(box.width).toBeGreaterThan(300);
        expect(box.x + box.width).toBeLessThanOrEqual(960);
        expect(
          await page
            .locator('figure.iw-batch td.iw-n')
            .first()
            .evaluate((e) => getComputedStyle(e).textAlign),
        ).toBe('right');
        // Two counted rows and the line not counted ('KCl 3 furlongs'), whose reason wraps inside the page.
        expect(await table.locator('tbody tr').count()).toBe(3);
        expect(await table.locator('tbody tr.iw-skipped td.iw-reason').textContent()).toMatch(/^not counted: Unknown unit 'furlongs'/);
        expect(await table.locator('tbody tr.iw-skipped td.iw-reason').evaluate((e) => getComputedStyle(e).whiteSpace)).toBe('normal');

        // Colours come from the theme: body text and table text legible (WCAG AA 4.5:1), markers visible.
        const colours = await page.evaluate(() => {
          const bg = getComputedStyle(document.body).backgroundColor;
          const c = (sel: string) => getComputedStyle(document.querySelector(sel) as Element).color;
          const border = getComputedStyle(document.querySelector('table.iw-table td') as Element).borderTopColor;
          return {
            bg,
            text: c('figure.iw-batch td'),
            error: c('a.iw-flag.iw-error'),
            warning: c('a.iw-flag.iw-warning'),
            ok: c('.iw-mark.iw-balanced'),
            border,
          };
        });
        expect(contrast(colours.text, colours.bg)).toBeGreaterThanOrEqual(4.5);
        for (const k of ['error', 'warning', 'ok'] as const) expect(contrast(colours[k], colours.bg), k).toBeGreaterThanOrEqual(theme === 'light' ? 2.2 : 3);
        // The error marker uses the theme's error colour, not a colour of our own.
        const themeError = VSCODE_THEMES[theme].vars['--vscode-editorError-foreground'];
        const rgb = themeError
          .match(/[0-9a-f]{2}/gi)!
          .map((h) => parseInt(h, 16))
          .join(', ');
        expect(colours.error).toBe(`rgb(${rgb})`);
        if (theme === 'high-contrast') expect(colours.border).toBe('rgb(111, 195, 223)');

        // The markers link to the list at the end.
        await page.locator('a.iw-flag').first().click();
        expect(await page.evaluate(() => location.hash)).toMatch(/^#iw-problem-1$/);

        await page.screenshot({ path: outputPath(`preview-${theme}.png`), fullPage: true });
      } finally {
        await page.close();
      }
    }, 60_000);
  }

  it('outside VS Code the styles fall back to colours of their own, light or dark with the system', async () => {
    for (const scheme of ['light', 'dark'] as const) {
      const page = await browser.newPage({ colorScheme: scheme, viewport: { width: 960, height: 700 } });
      try {
        const bg = scheme === 'dark' ? '#16181b' : '#ffffff';
        await page.setContent(
          `<!doctype html><html><head><meta charset="utf-8"><style>body{background:${bg};color:var(--iw-fg)}</style><style>${CSS}</style></head><body>${html}</body></html>`,
        );
        const c = await page.evaluate(() => {
          const col = (sel: string) => getComputedStyle(document.querySelector(sel) as Element).color;
          return {
            bg: getComputedStyle(document.body).backgroundColor,
            fg: getComputedStyle(document.body).color,
            error: col('a.iw-flag.iw-error'),
            warning: col('a.iw-flag.iw-warning'),
            ok: col('.iw-mark.iw-balanced'),
          };
        });
        // Our own colours meet WCAG AA for text (4.5:1) on the page background.
        for (const k of ['fg', 'error', 'warning', 'ok'] as const) expect(contrast(c[k], c.bg), `${scheme} ${k}`).toBeGreaterThanOrEqual(4.5);
        await page.screenshot({ path: outputPath(`preview-fallback-${scheme}.png`), fullPage: true });
      } finally {
        await page.close();
      }
    }
  }, 60_000);
});

describe.skipIf(HAVE_BROWSER || REQUIRE_BROWSER)('the preview in headless Chromium', () => {
  it.skip('needs /usr/bin/chromium (Debian package chromium); .ci/run installs it', () => {});
});
