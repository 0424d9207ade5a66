// @vitest-environment happy-dom
// The instrument profile form against the real store on fake-indexeddb (a fresh database per test).
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { InstrumentsScreen } from '../../../src/ui/screens/InstrumentsScreen';
import { StoreError, demoInstruments, describeStorageError, eraseStore, openStore, type Store } from '../../../src/store';
import { unsavedDescriptions } from '../../../src/ui/offline';
import { freshName } from '../store/helpers';
import { waitFor } from '../waitFor';

let open: { store: Store; name: string } | null = null;

async function freshStore(): Promise<Store> {
  const name = freshName();
  const store = await openStore(name);
  for (const p of demoInstruments) await store.restoreInstrument(p);
  open = { store, name };
  return store;
}

async function mount(store: Store, path: string): Promise<HTMLElement> {
  history.pushState(null, '', path);
  const host = document.createElement('div');
  document.body.appendChild(host);
  const ctx: AppContextValue = {
    store, storeProblem: null, instruments: [...demoInstruments], instrument: demoInstruments[0],
    selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify: vi.fn(),
  };
  await act(async () => { render(<AppContext.Provider value={ctx}><InstrumentsScreen /></AppContext.Provider>, host); });
  await waitFor(() => host.querySelector('#profile-name'), 'the profile form');
  return host;
}

async function type(el: Element | null, text: string) {
  const input = el as HTMLInputElement;
  await act(async () => {
    input.value = text;
    input.dispatchEvent(new Event('input', { bubbles: true }));
  });
}

const submit = (host: HTMLElement) =>
  act(async () => { (host.querySelector('form') as HTMLFormElement).dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });

afterEach(async () => {
  for (const host of document.body.children) render(null, host);
  document.body.innerHTML = '';
  vi.restoreAllMocks();
  if (open) {
    open.store.close();
    await eraseStore(open.name);
    open = null;
  }
});

describe('instrument profile form', () => {
  it('shows a field message naming the range for a bad value, and keeps what was typed', async () => {
    const store = await freshStore();
    const save = vi.spyOn(store, 'saveInstrument');
    const host = await mount(store, '/instruments/new');
    await type(host.querySelector('#profile-name'), 'Bench quad');
    await type(host.querySelector('#profile-rodFieldRadius'), '-3');
    await submit(host);
    await waitFor(() => host.textContent?.includes('Field radius r0 -3 mm is out of range: enter a value between 0.5 and 20 mm.'), 'the r0 range message');
    expect(save).not.toHaveBeenCalled();
    expect(await store.listInstruments()).toHaveLength(demoInstruments.length);
    expect((host.querySelector('#profile-rodFieldRadius') as HTMLInputElement).value).toBe('-3');
    expect((host.querySelector('#profile-name') as HTMLInputElement).value).toBe('Bench quad');
    // What was typed is also kept on the device, for a reload.
    await waitFor(async () => (await store.getDraft<{ name: string; rodFieldRadius: string }>('instrument-form:new'))?.rodFieldRadius === '-3', 'the kept draft');
  });

  it('when the device refuses the write, shows a plain message and the input stays on screen', async () => {
    const store = await freshStore();
    const save = vi.spyOn(store, 'saveInstrument').mockRejectedValue(new StoreError('Could not save the instrument profile: this device has no storage space left for Rodside. What you typed is still here.'));
    const host = await mount(store, `/instruments/${demoInstruments[0].id}`);
    await type(host.querySelector('#profile-name'), 'Renamed before a full disk');
    await submit(host);
    await waitFor(() => /no storage space left/.test(host.querySelector('[role="alert"]')?.textContent ?? ''), 'the refusal message');
    expect(save).toHaveBeenCalledTimes(1);
    expect((host.querySelector('#profile-name') as HTMLInputElement).value).toBe('Renamed before a full disk');
    expect((host.querySelector('#profile-rodFieldRadius') as HTMLInputElement).value).toBe('4.5');
    expect((await store.getInstrument(demoInstruments[0].id))?.name).toBe(demoInstruments[0].name);
  });

  it('restores a kept draft instead of the stored profile', async () => {
    const store = await freshStore();
    const kept = { name: 'Typed before reload', kind: 'rga', rodFieldRadius: '3', rodLength: '100', rfFrequency: '2.5', maxRfAmplitude: '900', axialEnergy: '8', amplitude: 'zero-to-peak', reference: 'per-rod', notes: '' };
    await store.putDraft('instrument-form:new', kept);
    const host = await mount(store, '/instruments/new');
    await waitFor(() => (host.querySelector('#profile-name') as HTMLInputElement).value === 'Typed before reload', 'the kept name');
    expect(host.textContent).toContain('Restored the input you had not saved yet.');
  });

  it('when the draft cannot be kept (database closed under the form), says so beside the form and keeps the input', async () => {
    const store = await freshStore();
    const host = await mount(store, '/instruments/new');
    expect(host.querySelector('[data-testid="draft-problem"]')).toBeNull();
    // The real store's connection goes away (as when another tab upgrades the database): every write now throws.
    store.db.close();
    await type(host.querySelector('#profile-name'), 'Typed while the database was closed');
    const message = await waitFor(() => host.querySelector('[data-testid="draft-problem"]'), 'the draft problem message');
    expect(message.getAttribute('role')).toBe('status');
    expect(message.textContent).toBe(
      "Couldn't save your draft on this device: the database was closed, probably because Rodside was updated in another tab. " +
      'Your input is still here; keep this screen open and try again, or note it elsewhere before you leave.',
    );
    expect((host.querySelector('#profile-name') as HTMLInputElement).value).toBe('Typed while the database was closed');
    // The form still counts as unsaved input, so an app update waits.
    expect(unsavedDescriptions()).toContain('the instrument profile form');
  });

  it('a full device: the message names the reason, and goes once a later keystroke is kept', async () => {
    const store = await freshStore();
    const host = await mount(store, '/instruments/new');
    const full = Object.assign(new Error('The quota has been exceeded.'), { name: 'QuotaExceededError' });
    const put = vi.spyOn(store, 'putDraft').mockRejectedValueOnce(describeStorageError('keep a draft', full));
    await type(host.querySelector('#profile-name'), 'Heron spare');
    const message = await waitFor(() => host.querySelector('[data-testid="draft-problem"]'), 'the draft problem message');
    expect(message.textContent).toMatch(/^Couldn't save your draft on this device: this device has no storage space left for Rodside\. Your input is still here;/);
    expect((host.querySelector('#profile-name') as HTMLInputElement).value).toBe('Heron spare');
    await type(host.querySelector('#profile-name'), 'Heron spare 2');
    await waitFor(() => host.querySelector('[data-testid="draft-problem"]') === null, 'the message to go once the draft is kept');
    expect(put).toHaveBeenCalledTimes(2);
    expect((await store.getDraft<{ name: string }>('instrument-form:new'))?.name).toBe('Heron spare 2');
  });
});
