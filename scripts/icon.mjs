// Renders media/icon.svg to media/icon.png (128×128, the size the marketplace shows) with headless Chromium.
import { readFileSync } from 'node:fs';
import { chromium } from 'playwright-core';

const svg = readFileSync('media/icon.svg', 'utf8');
const browser = await chromium.launch({
  executablePath: process.env.IONWRIGHT_CHROMIUM ?? '/usr/bin/chromium',
  args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
});
const page = await browser.newPage({ viewport: { width: 128, height: 128 } });
await page.setContent(`<html><body style="margin:0;background:transparent">${svg}</body></html>`);
await page.locator('svg').screenshot({ path: 'media/icon.png', omitBackground: true });
await browser.close();
console.log('media/icon.png written');
