import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** The stack under test, started by `npm test` (scripts/lib/e2e.mjs). */
export const BASE_URL = process.env.E2E_BASE_URL ?? 'http://127.0.0.1:4380';
export const ARTIFACTS_DIR = process.env.E2E_ARTIFACTS ?? path.resolve('spec', 'artifacts');

const CHROMIUM_FLAGS = [
  '--no-sandbox',
  '--headless',
  '--disable-gpu',
  '--disable-dev-shm-usage',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

const LOCAL_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]']);

/** A page in Debian's Chromium that records console errors and requests to other hosts. */
export interface WatchedPage {
  page: Page;
  consoleErrors: string[];
  foreignRequests: string[];
  close(): Promise<void>;
}

export async function openPage(viewport = { width: 1366, height: 860 }): Promise<WatchedPage> {
  const profileDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-e2e-'));
  const context: BrowserContext = await chromium.launchPersistentContext(profileDir, {
    executablePath: process.env.CHROME_BIN ?? '/usr/bin/chromium',
    headless: true,
    args: CHROMIUM_FLAGS,
    viewport,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const consoleErrors: string[] = [];
  const foreignRequests: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') consoleErrors.push(message.text());
  });
  page.on('pageerror', (error) => consoleErrors.push(error.message));
  context.on('request', (request) => {
    const url = new URL(request.url());
    if ((url.protocol === 'http:' || url.protocol === 'https:') && !LOCAL_HOSTS.has(url.hostname)) foreignRequests.push(request.url());
  });
  return {
    page,
    consoleErrors,
    foreignRequests,
    async close() {
      await context.close();
      fs.rmSync(profileDir, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const file = path.join(ARTIFACTS_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: false });
  return file;
}

/**
 * Polls `check` in the page until it gives a truthy value, and returns that value. Unlike
 * page.waitForFunction, an async check is awaited: waitForFunction takes the Promise an
 * async function returns for a truthy answer and resolves at once.
 */
export async function waitInPage<A, R>(page: Page, check: (arg: A) => Promise<R> | R, arg: A, options: { timeoutMs: number; pollMs: number; what: string }): Promise<NonNullable<R>> {
  const deadline = Date.now() + options.timeoutMs;
  for (;;) {
    const value = await page.evaluate(check as (arg: A) => Promise<R>, arg);
    if (value) return value as NonNullable<R>;
    if (Date.now() > deadline) throw new Error(`timed out after ${options.timeoutMs / 1000} s waiting for ${options.what}`);
    await page.waitForTimeout(options.pollMs);
  }
}
