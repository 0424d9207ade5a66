// A small W3C WebDriver client (plain HTTP) for Debian's WebKitGTK: WebKitWebDriver under xvfb-run drives the
// MiniBrowser that libwebkit2gtk-4.1-0 ships, a real WebKit with service workers, Cache Storage and IndexedDB.
//
// MiniBrowser started with --automation (which WebDriver needs) keeps its website data in an ephemeral store:
// localStorage, IndexedDB and caches go when the session ends, and XDG_DATA_HOME is never written (checked on
// WebKitGTK 2.50). So a restart on the same data is not possible here; tests prove persistence across a full
// reload and a new tab in the same session instead.
import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll } from 'vitest';
import { appForFile, artifactsDir, portIsFree, testPort } from '../harness';

/** The locale the WebKit pass runs under: glibc's C locale, which WebKit turns into navigator.language === 'C'. */
export const WEBKIT_LOCALE = 'C.UTF-8';

/** MiniBrowser from WEBKIT_MINIBROWSER, the libwebkit2gtk-4.1-0 file list, or the usual Debian paths. */
export function miniBrowserPath(): string {
  const env = process.env.WEBKIT_MINIBROWSER;
  if (env && existsSync(env)) return env;
  try {
    const listed = execFileSync('dpkg', ['-L', 'libwebkit2gtk-4.1-0'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] })
      .split('\n')
      .find((l) => l.endsWith('/MiniBrowser'));
    if (listed && existsSync(listed)) return listed;
  } catch {
    // dpkg missing or package not installed: try the known paths below.
  }
  for (const p of ['/usr/lib/x86_64-linux-gnu/webkit2gtk-4.1/MiniBrowser', '/usr/lib/aarch64-linux-gnu/webkit2gtk-4.1/MiniBrowser']) {
    if (existsSync(p)) return p;
  }
  throw new Error('WebKitGTK MiniBrowser not found. Install it with: apt-get update && apt-get install -y webkit2gtk-driver xvfb');
}

/** Poll `probe` until it returns a value that is not undefined/false, or fail after `timeout` ms with `what`. */
export async function waitFor<T>(what: string, probe: () => Promise<T | undefined | false>, timeout = 30_000, interval = 150): Promise<T> {
  const deadline = Date.now() + timeout;
  let last = 'nothing yet';
  for (;;) {
    try {
      const v = await probe();
      if (v !== undefined && v !== false) return v as T;
      last = `last answer ${JSON.stringify(v) ?? 'undefined'}`;
    } catch (err) {
      last = `last error ${String(err)}`;
    }
    if (Date.now() > deadline) throw new Error(`Timed out after ${timeout} ms waiting for ${what} (${last})`);
    await new Promise((r) => setTimeout(r, interval));
  }
}

export interface Driver {
  port: number;
  url: string;
  stop(): Promise<void>;
}

/** Start `xvfb-run -a WebKitWebDriver --port=N` in its own process group; refuses an occupied port. */
export async function startDriver(port: number): Promise<Driver> {
  if (!(await portIsFree(port))) throw new Error(`Port ${port} is in use: stop the stray WebKitWebDriver before running the WebKit tests.`);
  const child: ChildProcess = spawn('xvfb-run', ['-a', 'WebKitWebDriver', `--port=${port}`], {
    detached: true,
    stdio: ['ignore', 'ignore', 'pipe'],
    env: { ...process.env, LANG: WEBKIT_LOCALE, LC_ALL: WEBKIT_LOCALE, LANGUAGE: '' },
  });
  let stderr = '';
  child.stderr?.on('data', (d: Buffer) => {
    stderr = (stderr + d.toString()).slice(-4000);
  });
  let exited = false;
  child.on('exit', () => {
    exited = true;
  });
  const url = `http://127.0.0.1:${port}`;
  const stop = async () => {
    if (exited || child.pid === undefined) return;
    try {
      process.kill(-child.pid, 'SIGTERM');
    } catch {
      return; // already gone
    }
    await waitFor('WebKitWebDriver to exit', async () => exited, 10_000).catch(() => {
      try {
        process.kill(-child.pid!, 'SIGKILL');
      } catch {
        // gone between the two signals
      }
    });
  };
  try {
    await waitFor('WebKitWebDriver to answer /status', async () => {
      if (exited) throw new Error(`WebKitWebDriver exited: ${stderr}`);
      const r = await fetch(`${url}/status`);
      const j = (await r.json()) as { value?: { ready?: boolean } };
      return j.value?.ready === true;
    }, 30_000);
  } catch (err) {
    await stop();
    throw err;
  }
  return { port, url, stop };
}

/** A web element reference: one key (the W3C web element identifier) whose value is the element's id. */
export type ElementRef = Record<string, string>;
const elementId = (el: ElementRef): string => {
  const id = Object.values(el)[0];
  if (typeof id !== 'string') throw new Error(`not an element reference: ${JSON.stringify(el)}`);
  return id;
};

export class WebDriverError extends Error {
  constructor(
    readonly error: string,
    message: string,
  ) {
    super(`${error}: ${message}`);
  }
}

/** One WebKit browser (one MiniBrowser process) driven over W3C WebDriver. */
export class WebKitSession {
  private constructor(
    readonly driver: Driver,
    readonly id: string,
  ) {}

  /** `dark: true` starts MiniBrowser with --dark-mode, so the page sees prefers-color-scheme: dark. */
  static async open(driver: Driver, opts: { size?: { width: number; height: number }; dark?: boolean } = {}): Promise<WebKitSession> {
    const size = opts.size ?? { width: 390, height: 844 };
    const caps = {
      capabilities: {
        alwaysMatch: {
          'webkitgtk:browserOptions': { binary: miniBrowserPath(), args: opts.dark ? ['--automation', '--dark-mode'] : ['--automation'] },
          unhandledPromptBehavior: 'ignore',
        },
      },
    };
    const value = await rawCommand<{ sessionId: string }>(driver.url, 'POST', '/session', caps);
    const s = new WebKitSession(driver, value.sessionId);
    await s.cmd('POST', '/window/rect', size).catch(() => undefined); // some window managers refuse; the default size still works
    return s;
  }

  cmd<T = unknown>(method: 'GET' | 'POST' | 'DELETE', path: string, body?: unknown): Promise<T> {
    return rawCommand<T>(this.driver.url, method, `/session/${this.id}${path}`, body ?? (method === 'POST' ? {} : undefined));
  }

  async goto(url: string): Promise<void> {
    await this.cmd('POST', '/url', { url });
  }

  async currentUrl(): Promise<string> {
    return this.cmd<string>('GET', '/url');
  }

  async reload(): Promise<void> {
    await this.cmd('POST', '/refresh');
  }

  /** Run `script` (a function body) in the page and return its result. */
  run<T = unknown>(script: string, ...args: unknown[]): Promise<T> {
    return this.cmd<T>('POST', '/execute/sync', { script, args });
  }

  /** Run `script` (a function body whose last argument is the callback) in the page and wait for it. */
  runAsync<T = unknown>(script: string, ...args: unknown[]): Promise<T> {
    return this.cmd<T>('POST', '/execute/async', { script, args });
  }

  /** The first element matching `css`, waiting for it to appear (screens load on first visit). */
  async find(css: string, timeout = 30_000): Promise<ElementRef> {
    return waitFor(`an element matching ${css}`, () => this.cmd<ElementRef>('POST', '/element', { using: 'css selector', value: css }), timeout);
  }

  /** The form control a visible <label> names (by its text, matched as a regular expression). */
  async fieldByLabel(label: RegExp): Promise<ElementRef> {
    return waitFor(`a field labelled ${label}`, () =>
      this.run<ElementRef | null>(
        `const re = new RegExp(arguments[0], arguments[1]);
         for (const l of document.querySelectorAll('label')) {
           if (!re.test(l.textContent || '')) continue;
           const c = l.control || (l.htmlFor ? document.getElementById(l.htmlFor) : l.querySelector('input,select,textarea'));
           if (c) return c;
         }
         return null;`,
        label.source,
        label.flags,
      ).then((v) => v ?? undefined),
    );
  }

  /** Replace a field's text by typing, as a user would. */
  async type(el: ElementRef, text: string): Promise<void> {
    const id = elementId(el);
    await this.cmd('POST', `/element/${id}/clear`);
    await this.cmd('POST', `/element/${id}/value`, { text });
  }

  /** Click as a user would. The element is first scrolled to the middle of the screen: the driver would scroll it
   *  only just into view, under the fixed bottom bar, and the click would land on the bar. */
  async click(el: ElementRef): Promise<void> {
    await this.run(`arguments[0].scrollIntoView({ block: 'center', inline: 'center' });`, el);
    await this.cmd('POST', `/element/${elementId(el)}/click`);
  }

  /** Click the button whose visible text matches. */
  async clickButton(name: RegExp): Promise<void> {
    const el = await waitFor(`a button named ${name}`, () =>
      this.run<ElementRef | null>(
        `const re = new RegExp(arguments[0], arguments[1]);
         for (const b of document.querySelectorAll('button')) if (re.test(b.textContent || '') && !b.disabled) return b;
         return null;`,
        name.source,
        name.flags,
      ).then((v) => v ?? undefined),
    );
    await this.click(el);
  }

  /**
   * Wait until the app has opened its database and listed the instruments (the picker in the top bar has entries).
   * Tests wait for this before leaving a page, so each page is tested with its data. (A page left while its
   * database work was still running used to hold that work in WebKit's back/forward cache and stall the next page;
   * the app now lets go of it on pagehide, see Store.suspend.)
   */
  async appReady(timeout = 30_000): Promise<void> {
    await waitFor('the app to open its data (instrument picker filled)', () => this.run<boolean>(`return !!document.querySelector('.picker select option');`), timeout);
  }

  /** Text of every element matching `css`. */
  texts(css: string): Promise<string[]> {
    return this.run<string[]>(`return [...document.querySelectorAll(arguments[0])].map((e) => e.textContent || '');`, css);
  }

  async windows(): Promise<string[]> {
    return this.cmd<string[]>('GET', '/window/handles');
  }

  /** Open a new tab in the same browser and switch to it. */
  async newTab(): Promise<string> {
    const { handle } = await this.cmd<{ handle: string }>('POST', '/window/new', { type: 'tab' });
    await this.cmd('POST', '/window', { handle });
    return handle;
  }

  /** Save a PNG of the viewport to test-artifacts/<name>.png. */
  async screenshot(name: string): Promise<string> {
    const b64 = await this.cmd<string>('GET', '/screenshot');
    mkdirSync(artifactsDir, { recursive: true });
    const path = join(artifactsDir, `${name}.png`);
    writeFileSync(path, Buffer.from(b64, 'base64'));
    return path;
  }

  async close(): Promise<void> {
    await rawCommand(this.driver.url, 'DELETE', `/session/${this.id}`);
  }
}

async function rawCommand<T>(base: string, method: string, path: string, body?: unknown): Promise<T> {
  const r = await fetch(base + path, {
    method,
    headers: body === undefined ? undefined : { 'content-type': 'application/json; charset=utf-8' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await r.text();
  let j: { value?: unknown } = {};
  try {
    j = JSON.parse(text) as { value?: unknown };
  } catch {
    throw new WebDriverError('bad response', `${method} ${path} → HTTP ${r.status}: ${text.slice(0, 300)}`);
  }
  if (!r.ok) {
    const v = (j.value ?? {}) as { error?: string; message?: string };
    throw new WebDriverError(v.error ?? `HTTP ${r.status}`, `${method} ${path}: ${v.message ?? text.slice(0, 300)}`);
  }
  return j.value as T;
}

/** The built app, a WebKit driver and one browser session for the test file that calls this (at the top level). */
export interface WebKitApp {
  origin: string;
  driver: Driver | null;
  session: WebKitSession | null;
  /** Stop the server for good: from here on only the service worker serves the app. */
  stopServer(): Promise<void>;
}

export function webkitAppForFile(basePort: number, driverBasePort: number): WebKitApp {
  const app = appForFile(basePort);
  const wk: WebKitApp = { origin: app.origin, driver: null, session: null, stopServer: app.stopServer };
  beforeAll(async () => {
    wk.driver = await startDriver(testPort(driverBasePort));
    wk.session = await WebKitSession.open(wk.driver);
  });
  afterAll(async () => {
    await wk.session?.close().catch(() => undefined);
    await wk.driver?.stop();
  });
  return wk;
}

