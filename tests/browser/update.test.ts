// Foundation: a version built after the first load is offered, and applied only when the user agrees, never
// while a form holds unsaved input.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import type { PreviewServer } from 'vite';
import { buildApp, freshProfileDir, openBrowser, projectRoot, removeDir, startPreview, stopPreview, waitForServiceWorkerControl, type Session, testPort } from './harness';

const PORT = testPort(4312);
const origin = `http://127.0.0.1:${PORT}`;
const outDir = join(projectRoot, '.tmp', 'update-build');
const profile = freshProfileDir();
let server: PreviewServer | null = null;
let session: Session | null = null;

async function versionShown(s: Session): Promise<string | null> {
  await s.page.goto(origin + '/safety');
  return s.page.getByTestId('app-version').textContent();
}

beforeAll(async () => {
  await buildApp(outDir, 'first');
  server = await startPreview(outDir, PORT);
});
afterAll(async () => {
  await session?.close().catch(() => undefined);
  await stopPreview(server).catch(() => undefined);
  removeDir(profile);
  removeDir(outDir);
});

describe('updates are offered, never forced', () => {
  it('shows "update ready" for a newer build and applies it only after the user agrees', async () => {
    session = await openBrowser(profile);
    const { page } = session;
    await page.goto(origin + '/');
    await waitForServiceWorkerControl(page);
    expect(await versionShown(session)).toBe('0.1.0+first');

    // Deploy a second build at the same address.
    await stopPreview(server);
    await buildApp(outDir, 'second');
    server = await startPreview(outDir, PORT);

    await page.goto(origin + '/instruments/new');
    await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.update());
    await page.getByTestId('update-ready').waitFor({ timeout: 30_000 });

    // Not applied by itself: a reload still runs the first version and still offers the update.
    await page.reload();
    await page.getByTestId('update-ready').waitFor({ timeout: 30_000 });
    expect(await versionShown(session)).toBe('0.1.0+first');

    // Unsaved input blocks the update.
    await page.goto(origin + '/instruments/new');
    await page.getByLabel('Name').fill('Half-typed profile');
    await page.getByRole('button', { name: 'Update now' }).click();
    await expect.poll(() => page.getByTestId('update-ready').textContent()).toContain('Save or discard first');
    await page.waitForTimeout(1500);
    expect(await page.getByLabel('Name').inputValue()).toBe('Half-typed profile');

    // Discard, then agree: the new version takes over.
    await page.getByRole('button', { name: /Discard changes|Cancel/ }).click();
    await expect.poll(() => page.url()).toBe(origin + '/instruments');
    await Promise.all([
      page.waitForEvent('load', { timeout: 30_000 }),
      page.getByRole('button', { name: 'Update now' }).click(),
    ]);
    await expect.poll(() => versionShown(session!), { timeout: 30_000 }).toBe('0.1.0+second');
    expect(session.foreignRequests).toEqual([]);
  });
});
