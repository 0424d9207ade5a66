// Foundation: the service worker takes control on first visit; with the network cut and the server stopped, a
// reload, a deep link and a cold restart on the same profile all render with data read back from IndexedDB;
// no request ever leaves localhost.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PreviewServer } from 'vite';
import { distDir, freshProfileDir, openBrowser, removeDir, screenshot, startPreview, stopPreview, waitForServiceWorkerControl, type Session, testPort } from './harness';

const PORT = testPort(4311);
const origin = `http://127.0.0.1:${PORT}`;
let server: PreviewServer | null = null;
const profile = freshProfileDir();
let session: Session | null = null;
const foreign: string[] = [];

beforeAll(async () => {
  server = await startPreview(distDir, PORT);
});
afterAll(async () => {
  if (session) foreign.push(...session.foreignRequests);
  await session?.close().catch(() => undefined);
  await stopPreview(server).catch(() => undefined);
  removeDir(profile);
});

describe('installable offline app', () => {
  it('(a) the service worker takes control on the first visit, and the demo instruments load', async () => {
    session = await openBrowser(profile);
    const { page } = session;
    await page.goto(origin + '/');
    await waitForServiceWorkerControl(page);
    await expect.poll(() => page.locator('[data-testid="current-instrument"]').textContent()).toMatch(/\(demo\)[\s\S]*3 profiles on this device/);
    const manifest = await page.evaluate(async () => {
      const link = document.querySelector('link[rel="manifest"]') as HTMLLinkElement | null;
      if (!link) return null;
      return (await fetch(link.href)).json();
    });
    expect(manifest?.name).toContain('Rodside');
    expect(manifest?.icons.map((i: { sizes: string }) => i.sizes)).toEqual(expect.arrayContaining(['192x192', '512x512']));
    expect(manifest?.icons.some((i: { purpose?: string }) => i.purpose === 'maskable')).toBe(true);
    await screenshot(page, 'overview');
  });

  it('keeps a profile created online, then renders offline on reload, deep link and cold restart', async () => {
    const { page } = session!;
    await page.goto(origin + '/instruments/new');
    await page.getByLabel('Name').fill('Offline proof quad');
    await page.getByLabel(/Field radius r0/).fill('4,0');
    await page.getByLabel(/Rod length/).fill('200');
    await page.getByLabel(/RF frequency/).fill('1.2');
    await page.getByLabel(/Largest RF amplitude/).fill('3000');
    await page.getByLabel(/Ion axial energy/).fill('3');
    await page.getByRole('button', { name: 'Save profile' }).click();
    await expect.poll(() => page.url()).toBe(origin + '/instruments');
    await expect.poll(() => page.locator('[data-testid="instrument-card"]').allTextContents()).toEqual(
      expect.arrayContaining([expect.stringContaining('Offline proof quad')]),
    );

    // Cut the network and stop the server.
    await session!.context.setOffline(true);
    await stopPreview(server);
    server = null;

    await page.reload();
    await expect.poll(() => page.locator('[data-testid="instrument-card"]').allTextContents()).toEqual(
      expect.arrayContaining([expect.stringContaining('Offline proof quad')]),
    );

    await page.goto(origin + '/safety');
    await expect.poll(() => page.locator('h1').textContent()).toBe('Safety & about');
    await page.goto(origin + '/instruments');
    await expect.poll(() => page.locator('[data-testid="instrument-card"]').count()).toBe(4);

    foreign.push(...session!.foreignRequests);
    await session!.close();
    session = null;

    // Cold restart on the same profile, server still stopped.
    session = await openBrowser(profile);
    await session.context.setOffline(true);
    await session.page.goto(origin + '/instruments');
    await expect.poll(() => session!.page.locator('[data-testid="instrument-card"]').allTextContents()).toEqual(
      expect.arrayContaining([expect.stringContaining('Offline proof quad')]),
    );
    await screenshot(session.page, 'instruments-offline');
  });

  it('control: a fresh profile cannot open the app with the server stopped', async () => {
    const otherProfile = freshProfileDir();
    const other = await openBrowser(otherProfile);
    try {
      await expect(other.page.goto(origin + '/')).rejects.toThrow(/ERR_CONNECTION_REFUSED|ERR_INTERNET_DISCONNECTED/);
    } finally {
      await other.close();
      removeDir(otherProfile);
    }
  });

  it('(c) no request left localhost during the whole run, and no page errors', () => {
    if (session) foreign.push(...session.foreignRequests);
    expect(foreign).toEqual([]);
    expect(session?.pageErrors ?? []).toEqual([]);
  });
});
