// Shared set-up for browser tests: Debian Chromium through playwright-core, the built app through vite preview.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, mkdirSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { preview, build, type PreviewServer } from 'vite';
import { afterAll, beforeAll } from 'vitest';

export const projectRoot = resolve(__dirname, '../..');
export const artifactsDir = join(projectRoot, 'test-artifacts');

/** Chromium from CHROMIUM_PATH, /usr/bin/chromium, or the PATH. Never downloads a browser. */
export function chromiumPath(): string {
  const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium'].filter(Boolean) as string[];
  for (const c of candidates) if (existsSync(c)) return c;
  try {
    return execFileSync('sh', ['-c', 'command -v chromium'], { encoding: 'utf8' }).trim();
  } catch {
    throw new Error('Chromium not found. Install it with: apt-get update && apt-get install -y chromium (or set CHROMIUM_PATH).');
  }
}

export const chromiumArgs = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

/** A test file's fixed port, moved by RODSIDE_PORT_OFFSET so two checkouts can run browser tests side by side. */
export function testPort(base: number): number {
  const offset = Number(process.env.RODSIDE_PORT_OFFSET ?? 0);
  return base + (Number.isInteger(offset) ? offset : 0);
}

export async function portIsFree(port: number): Promise<boolean> {
  return new Promise((res) => {
    const srv = createServer();
    srv.once('error', () => res(false));
    srv.listen(port, '127.0.0.1', () => srv.close(() => res(true)));
  });
}

/** Serve a built app with vite preview on a port that must be free (a stray server would corrupt the test). */
export async function startPreview(outDir: string, port: number): Promise<PreviewServer> {
  if (!(await portIsFree(port))) throw new Error(`Port ${port} is in use: stop the stray server before running browser tests.`);
  return preview({
    root: projectRoot,
    configFile: join(projectRoot, 'vite.config.ts'),
    logLevel: 'warn',
    build: { outDir },
    preview: { port, strictPort: true, host: '127.0.0.1' },
  });
}

export async function stopPreview(server: PreviewServer | null): Promise<void> {
  if (!server) return;
  const closed = new Promise<void>((res) => server.httpServer.close(() => res()));
  // Drop the browser's keep-alive sockets at once: close() alone waits for them to time out before the port is free.
  (server.httpServer as unknown as { closeAllConnections?: () => void }).closeAllConnections?.();
  await closed;
}

/** The built app for one test file: a preview server and a browser profile, with the session the file opens. */
export interface FileApp {
  origin: string;
  profile: string;
  session: Session | null;
  /** Stop the server for good: from here on only the service worker serves the app. */
  stopServer(): Promise<void>;
}

/**
 * Serve the built app for the test file that calls this (at the top level): the server starts before the file's
 * tests; after them the session is closed, the server stopped and the profile removed.
 */
export function appForFile(basePort: number): FileApp {
  const port = testPort(basePort);
  let server: PreviewServer | null = null;
  const app: FileApp = {
    origin: `http://127.0.0.1:${port}`,
    profile: freshProfileDir(),
    session: null,
    stopServer: async () => {
      const s = server;
      server = null;
      await stopPreview(s);
    },
  };
  beforeAll(async () => {
    server = await startPreview(distDir, port);
  });
  afterAll(async () => {
    await app.session?.close().catch(() => undefined);
    await stopPreview(server).catch(() => undefined);
    removeDir(app.profile);
  });
  return app;
}

/** The first visit: the overview, until a service worker controls the page and the demo profiles are listed. */
export async function firstVisit(page: Page, origin: string): Promise<void> {
  await page.goto(origin + '/');
  await waitForServiceWorkerControl(page);
  await page.waitForFunction(() => /\(demo\)/.test(document.querySelector('[data-testid="current-instrument"]')?.textContent ?? ''), undefined, { timeout: 30_000 });
}

/** From here on the demo Kestrel is the instrument in front of us, with the network cut and the server stopped. */
export async function offlineOnKestrel(app: FileApp): Promise<void> {
  const session = app.session!;
  await session.page.locator('.picker select').selectOption('demo-gcms-kestrel');
  await session.context.setOffline(true);
  await app.stopServer();
}

/** Build the app into `outDir` (for tests that need their own build, e.g. an update). */
export async function buildApp(outDir: string, label?: string): Promise<void> {
  const prev = process.env.RODSIDE_BUILD_LABEL;
  // Vitest sets NODE_ENV=test, which would make Vite build a development bundle (no service worker).
  const prevEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  if (label) process.env.RODSIDE_BUILD_LABEL = label;
  else delete process.env.RODSIDE_BUILD_LABEL;
  try {
    await build({ root: projectRoot, configFile: join(projectRoot, 'vite.config.ts'), mode: 'production', logLevel: 'warn', build: { outDir, emptyOutDir: true } });
  } finally {
    if (prev === undefined) delete process.env.RODSIDE_BUILD_LABEL;
    else process.env.RODSIDE_BUILD_LABEL = prev;
    process.env.NODE_ENV = prevEnv;
  }
}

export function freshProfileDir(): string {
  return mkdtempSync(join(tmpdir(), 'rodside-profile-'));
}

export interface Session {
  context: BrowserContext;
  page: Page;
  /** Every request that left localhost during the session: must stay empty. */
  foreignRequests: string[];
  /** Console errors and uncaught page errors. */
  pageErrors: string[];
  close(): Promise<void>;
}

export async function openBrowser(profileDir: string, opts: { viewport?: { width: number; height: number } } = {}): Promise<Session> {
  const context = await chromium.launchPersistentContext(profileDir, {
    executablePath: chromiumPath(),
    headless: true,
    args: chromiumArgs,
    viewport: opts.viewport ?? { width: 390, height: 844 },
  });
  const foreignRequests: string[] = [];
  const pageErrors: string[] = [];
  const watch = (page: Page) => {
    page.on('request', (req) => {
      const url = new URL(req.url());
      const local = url.hostname === 'localhost' || url.hostname === '127.0.0.1' || url.hostname === '[::1]';
      if (!local && !['data:', 'blob:', 'chrome-extension:', 'about:'].includes(url.protocol)) foreignRequests.push(req.url());
    });
    page.on('pageerror', (err) => pageErrors.push(String(err)));
  };
  context.pages().forEach(watch);
  context.on('page', watch);
  // Service-worker fetches are requests too.
  context.on('request', (req) => {
    const url = new URL(req.url());
    if (!['localhost', '127.0.0.1', '[::1]'].includes(url.hostname) && url.protocol.startsWith('http')) foreignRequests.push(req.url());
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    foreignRequests,
    pageErrors,
    close: () => context.close(),
  };
}

/** Wait until a service worker controls the page (first visit: clientsClaim makes this happen without reload). */
export async function waitForServiceWorkerControl(page: Page, timeout = 30_000): Promise<void> {
  await page.waitForFunction(() => !!navigator.serviceWorker?.controller, undefined, { timeout });
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(artifactsDir, { recursive: true });
  await page.screenshot({ path: join(artifactsDir, `${name}.png`), fullPage: true });
}

export function removeDir(dir: string): void {
  rmSync(dir, { recursive: true, force: true });
}

export const distDir = join(projectRoot, 'dist');
