/**
 * Headless Chromium for the tests that look at rendered pages: Debian's chromium at /usr/bin/chromium,
 * driven by playwright-core (which downloads no browser of its own). Where chromium is missing the tests
 * skip, unless IONWRIGHT_REQUIRE_BROWSER=1 (CI sets it), which turns the skip into a failure.
 */
import { existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser } from 'playwright-core';

export const CHROMIUM = process.env.IONWRIGHT_CHROMIUM ?? '/usr/bin/chromium';
export const HAVE_BROWSER = existsSync(CHROMIUM);
export const REQUIRE_BROWSER = process.env.IONWRIGHT_REQUIRE_BROWSER === '1';

/** Where screenshots go (not committed). */
export const OUTPUT = join(__dirname, '..', 'test-output');

export function outputPath(name: string): string {
  mkdirSync(OUTPUT, { recursive: true });
  return join(OUTPUT, name);
}

/** Start Chromium headless with no network chatter (this machine's network is closed). */
export async function launch(): Promise<Browser> {
  const { chromium } = await import('playwright-core');
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

/** WCAG 2.x contrast ratio of two CSS colours given as `rgb(r, g, b)` or `rgba(r, g, b, a)` (alpha ignored). */
export function contrast(a: string, b: string): number {
  const lum = (c: string) => {
    const [r, g, bl] = (c.match(/[\d.]+/g) ?? ['0', '0', '0'])
      .slice(0, 3)
      .map(Number)
      .map((v) => {
        const s = v / 255;
        return s <= 0.03928 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
      });
    return 0.2126 * r + 0.7152 * g + 0.0722 * bl;
  };
  const [hi, lo] = [lum(a), lum(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

/**
 * The theme variables VS Code's Markdown preview defines, for a light, a dark and a high-contrast theme
 * (values of VS Code's default themes as they appear in a webview, from memory; only the ones the styles read).
 */
export const VSCODE_THEMES = {
  light: {
    bodyClass: 'vscode-light',
    vars: {
      '--vscode-foreground': '#3b3b3b',
      '--vscode-editor-background': '#ffffff',
      '--vscode-descriptionForeground': '#717171',
      '--vscode-editorWidget-border': '#c8c8c8',
      '--vscode-textCodeBlock-background': '#f8f8f8',
      '--vscode-editorError-foreground': '#e51400',
      '--vscode-editorWarning-foreground': '#bf8803',
      '--vscode-editorInfo-foreground': '#1a85ff',
      '--vscode-testing-iconPassed': '#388a34',
      '--vscode-textLink-foreground': '#005fb8',
    },
  },
  dark: {
    bodyClass: 'vscode-dark',
    vars: {
      '--vscode-foreground': '#cccccc',
      '--vscode-editor-background': '#1f1f1f',
      '--vscode-descriptionForeground': '#9d9d9d',
      '--vscode-editorWidget-border': '#454545',
      '--vscode-textCodeBlock-background': '#2b2b2b',
      '--vscode-editorError-foreground': '#f85149',
      '--vscode-editorWarning-foreground': '#cca700',
      '--vscode-editorInfo-foreground': '#3794ff',
      '--vscode-testing-iconPassed': '#73c991',
      '--vscode-textLink-foreground': '#4daafc',
    },
  },
  'high-contrast': {
    bodyClass: 'vscode-high-contrast',
    vars: {
      '--vscode-foreground': '#ffffff',
      '--vscode-editor-background': '#000000',
      '--vscode-descriptionForeground': '#ffffff',
      '--vscode-contrastBorder': '#6fc3df',
      '--vscode-editorError-foreground': '#f48771',
      '--vscode-editorWarning-foreground': '#ffd370',
      '--vscode-editorInfo-foreground': '#3794ff',
      '--vscode-testing-iconPassed': '#73c991',
      '--vscode-textLink-foreground': '#21a6ff',
    },
  },
} as const;

export type ThemeName = keyof typeof VSCODE_THEMES;

/** A page as VS Code's preview would show it: theme variables on <html>, the theme class on <body>. */
export function previewPage(bodyHtml: string, css: string, theme: ThemeName): string {
  const t = VSCODE_THEMES[theme];
  const vars = Object.entries(t.vars)
    .map(([k, v]) => `${k}: ${v};`)
    .join(' ');
  return `<!doctype html><html style="${vars}"><head><meta charset="utf-8"><style>
body { font-family: sans-serif; font-size: 14px; line-height: 1.5; padding: 12px 26px; max-width: 900px;
  color: var(--vscode-foreground); background: var(--vscode-editor-background); }
a { color: var(--vscode-textLink-foreground); }
code { font-family: monospace; font-size: 0.92em; }
</style><style>${css}</style></head><body class="${t.bodyClass}">${bodyHtml}</body></html>`;
}
