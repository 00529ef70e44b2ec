import { defineConfig } from '@playwright/test';
import { execFileSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

/**
 * Browser tests drive Debian's Chromium against the real server: the built client (dist/), a temporary
 * database and uploads folder, on a free port. The config file is loaded again in every worker; the
 * values are chosen once, in the runner, and reach the workers through the environment.
 */
function freePort(): string {
  const script =
    "const s=require('net').createServer().listen(0,'127.0.0.1',()=>{process.stdout.write(String(s.address().port));s.close()})";
  return execFileSync(process.execPath, ['-e', script]).toString().trim();
}

process.env.ARCWRIGHT_E2E_PORT ??= freePort();
process.env.ARCWRIGHT_E2E_DIR ??= mkdtempSync(join(tmpdir(), 'arcwright-e2e-'));

const port = process.env.ARCWRIGHT_E2E_PORT;
const dir = process.env.ARCWRIGHT_E2E_DIR;
const root = resolve(import.meta.dirname, '../..');

export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export default defineConfig({
  testDir: '.',
  testMatch: '**/*.spec.ts',
  outputDir: join(import.meta.dirname, 'artifacts', 'results'),
  timeout: 60_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  retries: 0,
  reporter: [['list']],
  use: {
    baseURL: `http://127.0.0.1:${port}`,
    testIdAttribute: 'data-test',
    // Playwright starts each browser with a fresh, empty profile directory of its own.
    launchOptions: { executablePath: '/usr/lib/chromium/chromium', args: CHROMIUM_ARGS },
    viewport: { width: 1440, height: 900 },
    screenshot: 'only-on-failure',
    trace: 'off',
  },
  webServer: {
    command: 'npx tsx server/index.ts',
    cwd: root,
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 120_000,
    stdout: 'ignore',
    stderr: 'pipe',
    env: {
      NODE_ENV: 'production',
      PORT: port,
      DATABASE_PATH: join(dir, 'arcwright.sqlite'),
      UPLOADS_DIR: join(dir, 'uploads'),
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      SESSION_SECRET: 'e2e-only-secret-not-for-production',
    },
  },
});
