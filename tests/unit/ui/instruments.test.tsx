// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { InstrumentsScreen } from '../../../src/ui/screens/InstrumentsScreen';
import { StoreError, demoInstruments, type Store } from '../../../src/store';

function fakeStore(overrides: Partial<Store>): Store {
  return {
    getDraft: async () => undefined,
    putDraft: async () => undefined,
    clearDraft: async () => undefined,
    deletedInstrument: async () => undefined,
    ...overrides,
  } as unknown as Store;
}

function mount(store: Store, path: string): HTMLElement {
  history.pushState(null, '', path);
  const host = document.createElement('div');
  document.body.appendChild(host);
  const ctx: AppContextValue = {
    store, storeProblem: null, instruments: [...demoInstruments], instrument: demoInstruments[0],
    selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify: vi.fn(),
  };
  render(<AppContext.Provider value={ctx}><InstrumentsScreen /></AppContext.Provider>, host);
  return host;
}

async function settle() {
  for (let i = 0; i < 5; i++) await act(async () => { await new Promise((r) => setTimeout(r, 0)); });
}

function type(el: Element | null, text: string) {
  const input = el as HTMLInputElement;
  input.value = text;
  input.dispatchEvent(new Event('input', { bubbles: true }));
}

afterEach(() => {
  document.body.innerHTML = '';
});

describe('instrument profile form', () => {
  it('shows a field message naming the range for a bad value, and keeps what was typed', async () => {
    const save = vi.fn();
    const host = mount(fakeStore({ saveInstrument: save }), '/instruments/new');
    await settle();
    await act(async () => {
      type(host.querySelector('#profile-name'), 'Bench quad');
      type(host.querySelector('#profile-rodFieldRadius'), '-3');
    });
    await act(async () => { (host.querySelector('form') as HTMLFormElement).dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });
    await settle();
    expect(save).not.toHaveBeenCalled();
    expect(host.textContent).toContain('Field radius r0 -3 mm is out of range: enter a value between 0.5 and 20 mm.');
    expect((host.querySelector('#profile-rodFieldRadius') as HTMLInputElement).value).toBe('-3');
    expect((host.querySelector('#profile-name') as HTMLInputElement).value).toBe('Bench quad');
  });

  it('when the device refuses the write, shows a plain message and the input stays on screen', async () => {
    const save = vi.fn().mockRejectedValue(new StoreError('Could not save the instrument profile: this device has no storage space left for Rodside. What you typed is still here.'));
    const host = mount(fakeStore({ saveInstrument: save }), `/instruments/${demoInstruments[0].id}`);
    await settle();
    await act(async () => { type(host.querySelector('#profile-name'), 'Renamed before a full disk'); });
    await act(async () => { (host.querySelector('form') as HTMLFormElement).dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });
    await settle();
    expect(save).toHaveBeenCalledTimes(1);
    expect(host.querySelector('[role="alert"]')?.textContent).toMatch(/no storage space left/);
    expect((host.querySelector('#profile-name') as HTMLInputElement).value).toBe('Renamed before a full disk');
    expect((host.querySelector('#profile-rodFieldRadius') as HTMLInputElement).value).toBe('4.5');
  });

  it('restores a kept draft instead of the stored profile', async () => {
    const kept = { name: 'Typed before reload', kind: 'rga', rodFieldRadius: '3', rodLength: '100', rfFrequency: '2.5', maxRfAmplitude: '900', axialEnergy: '8', amplitude: 'zero-to-peak', reference: 'per-rod', notes: '' };
    const host = mount(fakeStore({ getDraft: (async () => kept) as Store['getDraft'] }), '/instruments/new');
    await settle();
    expect(host.textContent).toContain('Restored the input you had not saved yet.');
    expect((host.querySelector('#profile-name') as HTMLInputElement).value).toBe('Typed before reload');
  });
});
