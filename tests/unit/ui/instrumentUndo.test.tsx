// @vitest-environment happy-dom
// Deleting an instrument, reloading, and restoring it from the Instruments screen with its visits and readings,
// against the real store in fake-indexeddb.
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { InstrumentsScreen } from '../../../src/ui/screens/InstrumentsScreen';
import { openStore, type Store } from '../../../src/store';
import { freshName, registerCleanup } from '../store/helpers';

registerCleanup();

async function settle(until: () => boolean | Promise<boolean> = () => true) {
  for (let i = 0; i < 8; i++) await act(async () => { await new Promise((r) => setTimeout(r, 0)); });
  // Then wait for the condition itself (a restore writes every visit and reading), not for a count of ticks.
  for (let i = 0; i < 500 && !(await until()); i++) await act(async () => { await new Promise((r) => setTimeout(r, 10)); });
}

async function mount(store: Store): Promise<{ host: HTMLElement; notify: ReturnType<typeof vi.fn> }> {
  history.pushState(null, '', '/instruments');
  const host = document.createElement('div');
  document.body.appendChild(host);
  const notify = vi.fn();
  const ctx: AppContextValue = {
    store, storeProblem: null, instruments: await store.listInstruments(), instrument: null,
    selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify,
  };
  await act(async () => { render(<AppContext.Provider value={ctx}><InstrumentsScreen /></AppContext.Provider>, host); });
  await settle();
  return { host, notify };
}

afterEach(() => {
  document.body.innerHTML = '';
});

describe('restore a deleted instrument after a reload', () => {
  it('offers “Restore deleted <name>” while the copy is kept, and brings back the visits and readings', async () => {
    const name = freshName();
    const store = await openStore(name);
    await store.loadDemo(true);
    const kestrel = (await store.listInstruments()).find((p) => p.name.startsWith('Kestrel'))!;
    const visits = await store.listVisits(kestrel.id);
    const readings = await store.listInstrumentReadings(kestrel.id);
    expect(visits.length).toBeGreaterThan(0);

    const first = await mount(store);
    expect(first.host.querySelector('[data-testid="restore-deleted"]')).toBeNull();
    const card = [...first.host.querySelectorAll('[data-testid="instrument-card"]')].find((c) => c.textContent?.includes(kestrel.name))!;
    await act(async () => { [...card.querySelectorAll('button')].find((b) => b.textContent === 'Delete')!.click(); });
    await settle();
    expect(await store.getInstrument(kestrel.id)).toBeUndefined();
    expect(first.notify).toHaveBeenCalledWith(`Deleted “${kestrel.name}”.`, expect.objectContaining({ label: 'Undo' }));
    render(null, first.host);
    store.close();

    // The page reloads: a new connection and a fresh screen, the toast and anything in memory gone.
    const reopened = await openStore(name);
    const second = await mount(reopened);
    const offer = second.host.querySelector('[data-testid="restore-deleted"]');
    expect(offer?.textContent).toContain(`“${kestrel.name}” was deleted with ${visits.length} visits and ${readings.length} readings`);
    const button = [...offer!.querySelectorAll('button')].find((b) => b.textContent === `Restore deleted ${kestrel.name}`)!;
    await act(async () => { button.click(); });
    await settle(() => second.host.querySelector('[data-testid="restore-deleted"]') === null);
    expect(await reopened.getInstrument(kestrel.id)).toEqual(kestrel);
    expect((await reopened.listVisits(kestrel.id)).map((v) => v.id)).toEqual(visits.map((v) => v.id));
    expect((await reopened.listInstrumentReadings(kestrel.id)).length).toBe(readings.length);
    expect(second.host.querySelector('[data-testid="restore-deleted"]')).toBeNull();
    expect(second.notify).toHaveBeenCalledWith(`Restored “${kestrel.name}”.`);
    reopened.close();
  });
});
