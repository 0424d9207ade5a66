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
import { waitFor } from '../waitFor';

registerCleanup();


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
  // The cards come from the context; the restore offer (read from the store) is waited for where a test needs it.
  await waitFor(() => host.querySelectorAll('[data-testid="instrument-card"]').length > 0, 'the instrument cards');
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
    expect(await store.deletedInstrument()).toBeUndefined();
    expect(first.host.querySelector('[data-testid="restore-deleted"]')).toBeNull();
    const card = [...first.host.querySelectorAll('[data-testid="instrument-card"]')].find((c) => c.textContent?.includes(kestrel.name))!;
    await act(async () => { [...card.querySelectorAll('button')].find((b) => b.textContent === 'Delete')!.click(); });
    await waitFor(() => first.notify.mock.calls.length > 0, 'the “Deleted …” message');
    expect(await store.getInstrument(kestrel.id)).toBeUndefined();
    expect(first.notify).toHaveBeenCalledWith(`Deleted “${kestrel.name}”.`, expect.objectContaining({ label: 'Undo' }));
    render(null, first.host);
    store.close();

    // The page reloads: a new connection and a fresh screen, the toast and anything in memory gone.
    const reopened = await openStore(name);
    const second = await mount(reopened);
    const offer = await waitFor(() => second.host.querySelector('[data-testid="restore-deleted"]'), 'the restore offer after the reload');
    expect(offer?.textContent).toContain(`“${kestrel.name}” was deleted with ${visits.length} visits and ${readings.length} readings`);
    const button = [...offer!.querySelectorAll('button')].find((b) => b.textContent === `Restore deleted ${kestrel.name}`)!;
    await act(async () => { button.click(); });
    // The restore writes the profile, its visits and readings in one transaction, then the screen says so.
    await waitFor(() => second.notify.mock.calls.some((c) => c[0] === `Restored “${kestrel.name}”.`), 'the “Restored …” message');
    await waitFor(() => second.host.querySelector('[data-testid="restore-deleted"]') === null, 'the restore offer to go');
    expect(await reopened.getInstrument(kestrel.id)).toEqual(kestrel);
    expect((await reopened.listVisits(kestrel.id)).map((v) => v.id)).toEqual(visits.map((v) => v.id));
    expect((await reopened.listInstrumentReadings(kestrel.id)).length).toBe(readings.length);
    expect(second.host.querySelector('[data-testid="restore-deleted"]')).toBeNull();
    expect(second.notify).toHaveBeenCalledWith(`Restored “${kestrel.name}”.`);
    reopened.close();
  });
});
