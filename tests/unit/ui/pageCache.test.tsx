// @vitest-environment happy-dom
// The back/forward cache: a hidden page must let go of its database connection, so the page that replaces it,
// or a newer version's upgrade in another tab, never waits on it; shown again from the cache, it opens afresh.
// Real store on fake-indexeddb under the app's own database name.
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { App } from '../../../src/ui/App';
import { DB_NAME, DB_VERSION, eraseStore } from '../../../src/store';
import { waitFor } from '../waitFor';

let host: HTMLElement | null = null;

afterEach(async () => {
  if (host) await act(async () => render(null, host!));
  host?.remove();
  host = null;
  await eraseStore(DB_NAME);
});

async function mountApp(): Promise<HTMLElement> {
  host = document.createElement('div');
  document.body.appendChild(host);
  await act(async () => render(<App />, host!));
  await waitFor(() => (host!.querySelector('.picker select option') ? true : null), 'the instrument picker to list the demo profiles');
  return host;
}

function pageEvent(type: 'pagehide' | 'pageshow', persisted: boolean): Event {
  return Object.assign(new Event(type), { persisted });
}

/** Open the app's database at the next version from "another tab"; say whether it had to wait on this page. */
async function upgradeElsewhere(): Promise<{ blocked: boolean }> {
  let blocked = false;
  await new Promise<void>((resolve, reject) => {
    const req = indexedDB.open(DB_NAME, DB_VERSION + 1);
    req.onblocked = () => { blocked = true; };
    req.onsuccess = () => { req.result.close(); resolve(); };
    req.onerror = () => reject(req.error);
  });
  return { blocked };
}

describe('the app and the back/forward cache', () => {
  it('keeps its connection while shown: an upgrade elsewhere has to wait on it (the control)', async () => {
    const root = await mountApp();
    let blocked = false;
    const req = indexedDB.open(DB_NAME, DB_VERSION + 1);
    req.onblocked = () => { blocked = true; };
    req.onsuccess = () => req.result.close();
    // The shown page closes on "versionchange" and tells the user to reload: the upgrade is announced, not silent.
    await waitFor(() => blocked || root.querySelector('[role="alert"]'), 'the upgrade to be held up or announced');
    expect(root.textContent).toMatch(/newer version of Rodside/);
  });

  it('closes its database when the page is hidden, so nothing elsewhere waits on it', async () => {
    const root = await mountApp();
    await act(async () => { window.dispatchEvent(pageEvent('pagehide', true)); });
    expect(await upgradeElsewhere()).toEqual({ blocked: false });
    // Closing is quiet: no storage problem is shown for a page that was only put away.
    expect(root.querySelector('[role="alert"]')).toBeNull();
  });

  it('opens the database again when shown from the cache, and works as before', async () => {
    const root = await mountApp();
    const names = [...root.querySelectorAll('.picker option')].map((o) => o.textContent);
    await act(async () => { window.dispatchEvent(pageEvent('pagehide', true)); });
    await act(async () => { window.dispatchEvent(pageEvent('pageshow', true)); });
    // A write through the reopened store: choose another instrument, and see the choice kept in the database.
    const select = root.querySelector('.picker select') as HTMLSelectElement;
    const other = [...select.options].find((o) => !o.selected)!;
    await waitFor(async () => {
      await act(async () => {
        select.value = other.value;
        select.dispatchEvent(new Event('change', { bubbles: true }));
      });
      const kept = await new Promise<unknown>((resolve, reject) => {
        const req = indexedDB.open(DB_NAME);
        req.onsuccess = () => {
          const db = req.result;
          const get = db.transaction('settings').objectStore('settings').get('currentInstrumentId');
          get.onsuccess = () => { db.close(); resolve((get.result as { value?: unknown } | undefined)?.value); };
          get.onerror = () => { db.close(); reject(get.error); };
        };
        req.onerror = () => reject(req.error);
      });
      return kept === other.value;
    }, 'the instrument choice to be kept through the reopened database');
    expect([...root.querySelectorAll('.picker option')].map((o) => o.textContent)).toEqual(names);
    expect(root.querySelector('[role="alert"]')).toBeNull();
  });
});
