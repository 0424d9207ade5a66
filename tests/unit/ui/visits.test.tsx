// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { VisitsScreen } from '../../../src/ui/screens/VisitsScreen';
import { demoInstruments, eraseStore, openStore, type Store } from '../../../src/store';

const names: string[] = [];
let store: Store | null = null;

async function mount(path: string): Promise<HTMLElement> {
  const name = `rodside-ui-visits-${Date.now()}-${Math.random().toString(16).slice(2)}`;
  names.push(name);
  store = await openStore(name);
  await store.loadDemo();
  history.pushState(null, '', path);
  const host = document.createElement('div');
  document.body.appendChild(host);
  const ctx: AppContextValue = {
    store, storeProblem: null, instruments: [...demoInstruments], instrument: demoInstruments[0],
    selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify: vi.fn(),
  };
  await act(async () => { render(<AppContext.Provider value={ctx}><VisitsScreen /></AppContext.Provider>, host); });
  return host;
}

async function settle(page: HTMLElement, until: () => boolean) {
  for (let i = 0; i < 50 && !until(); i++) await act(async () => { await new Promise((r) => setTimeout(r, 10)); });
  expect(until()).toBe(true);
  return page;
}

function type(el: Element | null, text: string) {
  const input = el as HTMLInputElement;
  input.value = text;
  input.dispatchEvent(new Event('input', { bubbles: true }));
}

afterEach(async () => {
  document.body.innerHTML = '';
  store?.close();
  store = null;
  while (names.length) await eraseStore(names.pop()!);
});

describe('visit page', () => {
  it('shows notes with a script tag as plain text, and verdicts as a word with a symbol', async () => {
    const host = await mount('/visits/demo-visit-k6');
    await settle(host, () => host.querySelector('[data-testid="visit-notes"]') !== null && host.querySelectorAll('[data-testid="reading-row"]').length > 0);
    const notes = host.querySelector('[data-testid="visit-notes"]')!;
    expect(notes.textContent).toContain('<script>alert("notes are plain text")</script>');
    expect(notes.querySelector('script')).toBeNull();
    const fail = host.querySelector('[data-verdict="fail"]');
    expect(fail?.textContent).toBe('✗ fail');
    for (const v of host.querySelectorAll('[data-verdict]')) expect(v.textContent).toMatch(/^(✓ pass|△ borderline|✗ fail)$/);
    expect(host.textContent).not.toMatch(/NaN/);
  });

  it('refuses a bad value with the field and range named, keeps it, and saves a good one with its verdict', async () => {
    const host = await mount('/visits/demo-visit-k8');
    await settle(host, () => host.querySelector('#reading-value') !== null);
    const select = host.querySelector('#reading-type') as HTMLSelectElement;
    await act(async () => { select.value = 'multiplier-voltage'; select.dispatchEvent(new Event('change', { bubbles: true })); });
    await act(async () => { type(host.querySelector('#reading-value'), '9e9'); });
    const before = (await store!.listReadings('demo-visit-k8')).length;
    await act(async () => { (host.querySelector('[data-testid="reading-form"]') as HTMLFormElement).dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });
    await settle(host, () => /is above that/.test(host.textContent ?? ''));
    expect(host.textContent).toContain('Multiplier voltage (as set for the target gain) must be between 0 and 6000 V; 9e9 V is above that.');
    expect((host.querySelector('#reading-value') as HTMLInputElement).value).toBe('9e9');
    expect(await store!.listReadings('demo-visit-k8')).toHaveLength(before);

    await act(async () => { type(host.querySelector('#reading-value'), '1760'); });
    // Kestrel's baseline (installation visit) left the multiplier at 1420 V: 1760 V is +24 %, past the 20 % borderline.
    await settle(host, () => /Expected: 1420 V/.test(host.querySelector('[data-testid="reading-preview"]')?.textContent ?? ''));
    expect(host.querySelector('[data-testid="reading-preview"]')?.textContent).toContain('✗ fail');
    await act(async () => { (host.querySelector('[data-testid="reading-form"]') as HTMLFormElement).dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });
    await settle(host, () => (host.querySelector('#reading-value') as HTMLInputElement).value === '');
    const saved = (await store!.listReadings('demo-visit-k8')).filter((r) => r.entered.text === '1760');
    expect(saved).toHaveLength(1);
    expect(saved[0]).toMatchObject({ verdict: 'fail', value: 1760, expected: { basis: 'baseline', value: 1420 } });
  });

  it('says so plainly when a visit does not exist', async () => {
    const host = await mount('/visits/visit-gone');
    await settle(host, () => /Visit not found/.test(host.textContent ?? ''));
  });
});
