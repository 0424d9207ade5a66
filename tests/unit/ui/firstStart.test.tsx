// @vitest-environment happy-dom
// A first start: the screen needs the demo instruments only; the demo visits (each reading judged in a task of its
// own) follow while it draws. Real store on fake-indexeddb under the app's own database name.
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { App } from '../../../src/ui/App';
import { DB_NAME, demoInstruments, demoVisits, eraseStore, openStore } from '../../../src/store';
import { waitFor } from '../waitFor';

let host: HTMLElement | null = null;

afterEach(async () => {
  if (host) await act(async () => render(null, host!));
  host?.remove();
  host = null;
  history.replaceState(null, '', '/');
  await eraseStore(DB_NAME);
});

describe('a first start', () => {
  it('has the demo instruments readable before any demo visit is written (the store tells when)', async () => {
    const store = await openStore('rodside-first-start-test');
    try {
      let seen: Promise<[number, number]> | null = null;
      const loaded = await store.loadDemo(false, () => {
        // Reads started now see the database as it is at this point: they queue before the visits' writes.
        seen = Promise.all([store.listInstruments().then((l) => l.length), store.listVisits().then((l) => l.length)]);
      });
      expect(loaded).toBe(true);
      expect(seen).not.toBeNull();
      expect(await seen!).toEqual([demoInstruments.length, 0]);
      expect((await store.listVisits()).length).toBe(demoVisits.length);
      // Loaded already: nothing is written again and there is nothing to announce.
      let called = false;
      expect(await store.loadDemo(false, () => { called = true; })).toBe(false);
      expect(called).toBe(false);
    } finally {
      store.close();
      await eraseStore('rodside-first-start-test');
    }
  });

  it('lists every demo visit on the Visits screen once they are written, without a reload', async () => {
    history.replaceState(null, '', '/visits');
    host = document.createElement('div');
    document.body.appendChild(host);
    await act(async () => render(<App />, host!));
    const picked = await waitFor(() => (host!.querySelector('.picker select') as HTMLSelectElement | null)?.selectedOptions[0]?.textContent ?? null, 'the instrument picker');
    const instrument = demoInstruments.find((p) => p.name === picked)!;
    const expected = demoVisits.filter((v) => v.instrumentId === instrument.id).length;
    expect(expected).toBeGreaterThan(0);
    await waitFor(() => (host!.querySelectorAll('[data-testid="visit-item"]').length === expected ? true : null), `the ${expected} demo visits of ${picked}`);
    expect(host.textContent).not.toMatch(/Loading visits/);
  });
});
