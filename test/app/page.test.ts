/**
 * The page in a real browser: Debian's Chromium driven by playwright-core (never a downloaded browser), against
 * the production build served by `vite preview` on loopback. Skipped where /usr/bin/chromium is missing, except
 * under CI, where .ci/run installs it and a missing browser is a failure.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { chromium, type Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const CHROMIUM = '/usr/bin/chromium';
const PORT = 4179;
const available = existsSync(CHROMIUM);
if (!available && process.env.CI) throw new Error(`${CHROMIUM} is missing; .ci/run installs it with apt-get`);

let server: ChildProcess | undefined;
let browser: Browser | undefined;

async function waitForServer(url: string, timeoutMs: number): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no answer from ${url} within ${timeoutMs} ms`);
}

describe.skipIf(!available)('the page in Chromium', () => {
  beforeAll(async () => {
    const build = spawn('npx', ['vite', 'build', '--logLevel', 'error'], { stdio: 'inherit' });
    await new Promise<void>((resolve, reject) => build.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`vite build exited ${code}`)))));
    server = spawn('npx', ['vite', 'preview', '--port', String(PORT), '--strictPort'], { stdio: 'ignore', detached: true });
    await waitForServer(`http://127.0.0.1:${PORT}/`, 30_000);
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
    });
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    if (server?.pid) process.kill(-server.pid);
  });

  it('shows the presets and the demo candidates, with no errors in the console', async () => {
    const page = await browser!.newPage();
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    page.on('console', (message) => message.type() === 'error' && errors.push(message.text()));
    await page.goto(`http://127.0.0.1:${PORT}/`);
    await page.waitForSelector('#candidates tbody tr');
    expect(await page.locator('#presets tbody tr').count()).toBe(5);
    // The demo's measured 5.1 × 2.95 Å rectangle is the β12 cell (√3d × 3d at d = 1.69 Å; Feng et al., Nat. Chem. 8, 563 (2016)).
    expect(await page.locator('#candidates tbody').innerText()).toContain('beta12');
    expect(await page.locator('#demo-title').innerText()).toMatch(/^DEMO/);
    expect(errors).toEqual([]);
  });
});
