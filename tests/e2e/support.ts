import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { createApp } from '../../server/app';
import { configFromEnv } from '../../server/config';
import { createSequelize } from '../../server/db';

/**
 * The whole app as a person meets it: the built client and the API from one Express process on
 * 127.0.0.1, the real MariaDB behind it, and Debian's Chromium driven by playwright-core.
 */
export interface BrowserRig {
  baseUrl: string;
  browser: Browser;
  newPage: (viewport?: { width: number; height: number }) => Promise<{ page: Page; context: BrowserContext; consoleErrors: string[] }>;
  screenshot: (page: Page, name: string) => Promise<string>;
  close: () => Promise<void>;
}

export const outputDir = path.join(process.env.LOFTBENCH_TEST_OUTPUT ?? path.resolve('test-output'), 'screenshots');

export async function startRig(): Promise<BrowserRig> {
  const base = configFromEnv(process.env);
  if (!base.clientDir) throw new Error('LOFTBENCH_CLIENT_DIR is not set: run the browser tests through npm test, which builds the client');
  const config = { ...base, logLevel: 'silent' };
  const sequelize = createSequelize(config.db);
  const app = createApp({ config, sequelize });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  const baseUrl = `http://127.0.0.1:${port}`;

  // launch() gives every run a fresh, empty profile of its own.
  const browser = await chromium.launch({
    executablePath: process.env.LOFTBENCH_CHROMIUM || '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  mkdirSync(outputDir, { recursive: true });

  return {
    baseUrl,
    browser,
    async newPage(viewport = { width: 1280, height: 860 }) {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      const consoleErrors: string[] = [];
      page.on('console', (msg) => {
        if (msg.type() === 'error') consoleErrors.push(msg.text());
      });
      page.on('pageerror', (err) => consoleErrors.push(String(err)));
      return { page, context, consoleErrors };
    },
    async screenshot(page, name) {
      const file = path.join(outputDir, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
    async close() {
      await browser.close();
      await new Promise((resolve) => server.close(resolve));
      await sequelize.close();
    },
  };
}

/** Sign in through the form, as a person would. */
export async function signInThroughForm(page: Page, email: string, password: string) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/hulls/);
}
