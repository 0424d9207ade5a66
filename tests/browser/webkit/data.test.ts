// WebKit (the engine of iPhone and iPad browsers): a profile and a visit made through the screens survive a full
// reload and a new tab; a backup exported from the Visits screen, after erasing the device, restores identical
// data; and once the service worker controls the page, the app reloads and opens deep links with the server stopped.
//
// Why not a restart on the same data: WebDriver needs MiniBrowser's --automation mode, and in that mode MiniBrowser
// keeps website data in an ephemeral store (IndexedDB and caches are dropped when the session ends, nothing is
// written under XDG_DATA_HOME; checked on WebKitGTK 2.50). So persistence is proven across a full reload and a new
// tab, which read everything back from IndexedDB; the Chromium tests cover the cold restart on the same profile.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { waitFor, webkitAppForFile, type WebKitSession } from './driver';

const app = webkitAppForFile(4520, 4570);
const { origin } = app;
const scratch = mkdtempSync(join(tmpdir(), 'rodside-webkit-'));
let visitPath = '';

const PROFILE = 'WebKit proof quad';
const SITE = 'Harrowgate Basin, bay 4';

afterAll(() => {
  rmSync(scratch, { recursive: true, force: true });
});

/** Every record of every store of the app's database, read straight from IndexedDB in the page. */
function dumpDatabase(s: WebKitSession): Promise<Record<string, unknown[]>> {
  return s.runAsync<Record<string, unknown[]>>(
    `const done = arguments[arguments.length - 1];
     const open = indexedDB.open('rodside');
     open.onerror = () => done({ error: [String(open.error)] });
     open.onsuccess = () => {
       const db = open.result;
       const names = [...db.objectStoreNames].sort();
       const tx = db.transaction(names, 'readonly');
       const out = {};
       for (const n of names) {
         const req = tx.objectStore(n).getAll();
         req.onsuccess = () => { out[n] = req.result; };
       }
       tx.oncomplete = () => { db.close(); done(out); };
       tx.onerror = () => done({ error: [String(tx.error)] });
     };`,
  );
}

async function mainText(s: WebKitSession): Promise<string> {
  return s.run<string>(`return document.querySelector('main')?.textContent || '';`);
}

async function heading(s: WebKitSession): Promise<string> {
  return s.run<string>(`return document.querySelector('main h1')?.textContent?.trim() || '';`);
}

async function instrumentNames(s: WebKitSession): Promise<string[]> {
  return s.texts('[data-testid="instrument-card"]');
}

describe('WebKit: data kept on the device', () => {
  it('the service worker takes control on the first visit and the demo loads', async () => {
    const s = app.session!;
    await s.goto(origin + '/');
    await waitFor('the service worker to control the page', () => s.run<boolean>(`return !!navigator.serviceWorker && !!navigator.serviceWorker.controller;`));
    const current = await waitFor('the demo instruments', async () => {
      const t = (await s.texts('[data-testid="current-instrument"]'))[0];
      return t && /3 profiles on this device/.test(t) ? t : undefined;
    });
    expect(current).toMatch(/\(demo\)/);
    await s.appReady();
  });

  it('creates a profile and a visit through the screens', async () => {
    const s = app.session!;
    await s.goto(origin + '/instruments/new');
    await s.type(await s.fieldByLabel(/^\s*Name\s*$/), PROFILE);
    await s.type(await s.fieldByLabel(/Field radius r0/), '4,0');
    await s.type(await s.fieldByLabel(/Rod length/), '200');
    await s.type(await s.fieldByLabel(/RF frequency/), '1.2');
    await s.type(await s.fieldByLabel(/Largest RF amplitude/), '3000');
    await s.type(await s.fieldByLabel(/Ion axial energy/), '3');
    await s.clickButton(/^Save profile$/);
    await waitFor('the instruments list', async () => (await s.currentUrl()) === origin + '/instruments');
    await waitFor('the new profile in the list', async () => (await instrumentNames(s)).some((t) => t.includes(PROFILE)));

    await s.goto(origin + '/visits/new');
    await s.type(await s.find('#visit-engineer'), 'WebKit engineer');
    await s.type(await s.find('#visit-site'), SITE);
    await s.clickButton(/^Create visit$/);
    visitPath = await waitFor('the new visit page', async () => {
      const p = new URL(await s.currentUrl()).pathname;
      return /^\/visits\/visit-/.test(p) ? p : undefined;
    });
    await waitFor('the visit summary', async () => (await s.texts('[data-testid="visit-summary"]')).some((t) => t.includes(SITE)));
    await s.appReady();
  });

  it('keeps both across a full reload and in a new tab (read back from IndexedDB)', async () => {
    const s = app.session!;
    await s.goto(origin + '/instruments');
    await s.reload();
    await waitFor('the profile after a reload', async () => (await instrumentNames(s)).some((t) => t.includes(PROFILE)));
    expect(await instrumentNames(s)).toHaveLength(4);

    const first = (await s.windows())[0];
    await s.newTab();
    expect(await s.windows()).toHaveLength(2);
    await s.goto(origin + visitPath);
    await waitFor('the visit in a new tab', async () => (await s.texts('[data-testid="visit-summary"]')).some((t) => t.includes(SITE)));
    await s.goto(origin + '/instruments');
    await waitFor('the profile in a new tab', async () => (await instrumentNames(s)).some((t) => t.includes(PROFILE)));
    await s.cmd('DELETE', '/window');
    await s.cmd('POST', '/window', { handle: first });
  });

  it('backup round trip on the Visits screen: export, erase, restore gives identical data', async () => {
    const s = app.session!;
    // The backup tools sit behind their disclosure; the #backup link opens it, as the backup reminder does.
    await s.goto(origin + '/visits#backup');
    await waitFor('the backup panel', async () => (await s.texts('[data-testid="backup-panel"] button')).some((t) => /Download backup/.test(t)));
    const before = await dumpDatabase(s);
    expect(before.instruments?.length).toBe(4);
    expect(JSON.stringify(before.visits)).toContain(SITE);

    // The download goes to a Blob URL: keep the Blob the app hands to the browser so the test can read the file.
    await s.run(`window.__exported = [];
      const make = URL.createObjectURL.bind(URL);
      URL.createObjectURL = (b) => { window.__exported.push(b); return make(b); };`);
    await s.clickButton(/^Download backup$/);
    await waitFor('the backup file', () => s.run<boolean>(`return window.__exported.length > 0;`));
    const text = await s.runAsync<string>(`const done = arguments[arguments.length - 1]; window.__exported[0].text().then(done, (e) => done('ERROR ' + e));`);
    const backup = JSON.parse(text) as { format?: string };
    expect(backup.format).toBe('rodside-backup');
    const file = join(scratch, 'backup.json');
    writeFileSync(file, text);

    await waitFor('the download notice', async () => (await s.texts('.toast')).some((t) => /Backup downloaded/.test(t)));
    // The notice sits over the bottom of the screen, where the erase control is: wait until it goes, as a user would.
    await waitFor('the notice to go', async () => (await s.texts('.toast')).length === 0, 15_000);

    // Erase through the screen, answering the in-page confirmation (no native dialogs).
    await s.click(await s.find('[data-testid="backup-panel"] details summary'));
    await s.clickButton(/^Erase everything on this device$/);
    await s.clickButton(/^Yes, erase everything$/);
    const erased = await waitFor('the device to be empty', async () => {
      const d = await dumpDatabase(s);
      return (d.instruments?.length ?? -1) === 0 && (d.visits?.length ?? -1) === 0 ? d : undefined;
    });
    expect(erased.readings).toEqual([]);

    // Restore by choosing the file in the page's file field (WebDriver hands the field a path on disk).
    await s.type(await s.find('#backup-file'), file);
    const result = await waitFor('the restore result', async () => (await s.texts('[data-testid="restore-result"]'))[0] || undefined);
    expect(result).toMatch(/Restored: [1-9]\d* added, 0 updated, \d+ unchanged/);
    const after = await dumpDatabase(s);
    expect(after).toEqual(before);
    await s.appReady();
  });

  it('offline: with the server stopped, a reload and deep links still render from the service worker', async () => {
    const s = app.session!;
    await s.goto(origin + '/');
    await waitFor('the service worker to control the page', () => s.run<boolean>(`return !!navigator.serviceWorker.controller;`));
    await s.appReady();
    await app.stopServer();
    // The control: the server really is gone.
    await expect(fetch(origin + '/')).rejects.toThrow();

    await s.reload();
    await waitFor('the overview after an offline reload', async () => (await heading(s)) === 'Overview');
    await s.appReady();
    for (const [path, title] of [
      ['/stability/resolution', 'Stability · resolution planner'],
      [visitPath, null],
      ['/instruments', 'Instruments'],
    ] as const) {
      await s.goto(origin + path);
      const h = await waitFor(`${path} offline`, async () => {
        const t = await heading(s);
        return t && !/^Loading/.test(t) ? t : undefined;
      }).catch(async (err) => {
        await s.screenshot('webkit-offline-failure');
        throw new Error(`${String(err)}; main: ${(await mainText(s)).slice(0, 300)}`);
      });
      if (title) expect(h).toBe(title);
      expect(await mainText(s)).not.toMatch(/could not be loaded/);
      await s.appReady();
    }
    await waitFor('the restored profile offline', async () => (await instrumentNames(s)).some((t) => t.includes(PROFILE)));
    await s.goto(origin + visitPath);
    await waitFor('the restored visit offline', async () => (await s.texts('[data-testid="visit-summary"]')).some((t) => t.includes(SITE)));
    await s.screenshot('webkit-visit-offline');
  });
});
