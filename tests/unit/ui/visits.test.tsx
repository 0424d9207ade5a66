// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { VisitsScreen } from '../../../src/ui/screens/VisitsScreen';
import { demoInstruments, describeStorageError, eraseStore, openStore, type Store } from '../../../src/store';
import { waitFor } from '../waitFor';
import { openDisclosure } from './appHarness';

const names: string[] = [];
let store: Store | null = null;

async function mount(path: string, prepare?: (s: Store) => Promise<void>): Promise<HTMLElement> {
  const name = `rodside-ui-visits-${Date.now()}-${Math.random().toString(16).slice(2)}`;
  names.push(name);
  store = await openStore(name);
  await store.loadDemo();
  await prepare?.(store);
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


function type(el: Element | null, text: string) {
  const input = el as HTMLInputElement;
  input.value = text;
  input.dispatchEvent(new Event('input', { bubbles: true }));
}

afterEach(async () => {
  for (const host of document.body.children) render(null, host);
  document.body.innerHTML = '';
  vi.restoreAllMocks();
  store?.close();
  store = null;
  while (names.length) await eraseStore(names.pop()!);
});

describe('visit page', () => {
  it('when whether a backup is due cannot be read, says so and still lists the visits', async () => {
    const host = await mount('/visits', async (s) => {
      vi.spyOn(s, 'backupStatus').mockRejectedValue(new Error('the device refused the read'));
    });
    const banner = await waitFor(() => host.querySelector('.banner-problem')?.textContent, 'the problem banner');
    expect(banner).toMatch(/^Whether a backup is due could not be read: /);
    await waitFor(() => host.querySelectorAll('[data-testid="visit-item"]').length > 0, 'the visit list');
  });

  it('shows notes with a script tag as plain text, and verdicts as a word with a symbol', async () => {
    // The test's own hostile note (the demo's notes are ordinary text).
    const host = await mount('/visits/demo-visit-k6', async (s) => {
      const k6 = (await s.getVisit('demo-visit-k6'))!;
      await s.saveVisit({ ...k6, notes: `${k6.notes} <script>alert("notes are plain text")</script>` }, k6.id);
    });
    await waitFor(() => host.querySelector('[data-testid="visit-notes"]') !== null && host.querySelectorAll('[data-testid="reading-row"]').length > 0);
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
    await waitFor(() => host.querySelector('#reading-value') !== null);
    const select = host.querySelector('#reading-type') as HTMLSelectElement;
    await act(async () => { select.value = 'multiplier-voltage'; select.dispatchEvent(new Event('change', { bubbles: true })); });
    await act(async () => { type(host.querySelector('#reading-value'), '9e9'); });
    const before = (await store!.listReadings('demo-visit-k8')).length;
    await act(async () => { (host.querySelector('[data-testid="reading-form"]') as HTMLFormElement).dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });
    await waitFor(() => /is above that/.test(host.textContent ?? ''));
    expect(host.textContent).toContain('Multiplier voltage (as set for the wanted gain) must be between 0 and 6000 V; 9e9 V is above that.');
    expect((host.querySelector('#reading-value') as HTMLInputElement).value).toBe('9e9');
    expect(await store!.listReadings('demo-visit-k8')).toHaveLength(before);

    await act(async () => { type(host.querySelector('#reading-value'), '1760'); });
    // Kestrel's baseline (installation visit) left the multiplier at 1420 V: 1760 V is +24 %, past the 20 % borderline.
    await waitFor(() => /Expected: 1420 V/.test(host.querySelector('[data-testid="reading-preview"]')?.textContent ?? ''));
    expect(host.querySelector('[data-testid="reading-preview"]')?.textContent).toContain('✗ fail');
    await act(async () => { (host.querySelector('[data-testid="reading-form"]') as HTMLFormElement).dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });
    await waitFor(() => (host.querySelector('#reading-value') as HTMLInputElement).value === '');
    const saved = (await store!.listReadings('demo-visit-k8')).filter((r) => r.entered.text === '1760');
    expect(saved).toHaveLength(1);
    expect(saved[0]).toMatchObject({ verdict: 'fail', value: 1760, expected: { basis: 'baseline', value: 1420 } });
  });

  it('when the reading draft cannot be kept, says so beside the form and keeps the typed value', async () => {
    const host = await mount('/visits/demo-visit-k8');
    await waitFor(() => host.querySelector('#reading-value') !== null, 'the reading form');
    const full = Object.assign(new Error('The quota has been exceeded.'), { name: 'QuotaExceededError' });
    vi.spyOn(store!, 'putDraft').mockRejectedValue(describeStorageError('keep a draft', full));
    await act(async () => { type(host.querySelector('#reading-value'), '1500'); });
    await waitFor(() => host.querySelector('[data-testid="draft-problem"]') !== null, 'the draft problem message');
    const form = host.querySelector('[data-testid="reading-form"]')!;
    expect(form.querySelector('[data-testid="draft-problem"]')?.textContent).toMatch(/^Couldn't save your draft on this device: this device has no storage space left for Rodside\. Your input is still here;/);
    expect((host.querySelector('#reading-value') as HTMLInputElement).value).toBe('1500');
  });

  it('offers the calibrant ions chosen for the instrument, shows the air band, and does not offer earlier-design types', async () => {
    const host = await mount('/visits/demo-visit-k8');
    await waitFor(() => host.querySelector('#reading-value') !== null);
    const select = host.querySelector('#reading-type') as HTMLSelectElement;
    const offered = [...select.options].map((o) => o.value);
    expect(offered).toEqual(expect.arrayContaining(['calibrant-ratio', 'calibrant-isotope', 'air-ratio-28-32', 'water-18']));
    for (const old of ['leak-water-18', 'leak-nitrogen-28', 'leak-ratio-28-32', 'leak-argon-40', 'relative-abundance', 'isotope-ratio']) expect(offered).not.toContain(old);
    await act(async () => { select.value = 'calibrant-ratio'; select.dispatchEvent(new Event('change', { bubbles: true })); });
    await waitFor(() => host.querySelector('[data-testid="calibrant-choices"] button') !== null);
    const choices = [...host.querySelectorAll('[data-testid="calibrant-choices"] button')].map((b) => b.textContent);
    expect(choices).toEqual(['m/z 219 as % of m/z 69', 'm/z 502 as % of m/z 69']);
    expect(host.querySelector('[data-testid="calibrant-choices"]')?.textContent).toContain('chosen by the engineer on earlier visits');
    await act(async () => { (host.querySelectorAll('[data-testid="calibrant-choices"] button')[1] as HTMLButtonElement).click(); });
    expect((host.querySelector('#reading-mz') as HTMLInputElement).value).toBe('502');
    expect((host.querySelector('#reading-referenceMz') as HTMLInputElement).value).toBe('69');
    await act(async () => { type(host.querySelector('#reading-value'), '3.5'); });
    await waitFor(() => /Expected: 3\.6 %/.test(host.querySelector('[data-testid="reading-preview"]')?.textContent ?? ''));

    await act(async () => { select.value = 'air-ratio-28-32'; select.dispatchEvent(new Event('change', { bubbles: true })); });
    await act(async () => { type(host.querySelector('#reading-value'), '3.8'); });
    await waitFor(() => /Air looks like: 3\.7 to 4 ratio/.test(host.querySelector('[data-testid="reading-preview"]')?.textContent ?? ''));
    const preview = host.querySelector('[data-testid="reading-preview"]')!.textContent!;
    expect(preview).toContain('✗ fail');
    expect(preview).toContain('CRC Handbook of Chemistry and Physics');
  });

  it('names the walk and step a reading came from, once the diagnosis trees have loaded', async () => {
    const host = await mount('/visits/demo-visit-k8', async (s) => {
      await s.addReading({ visitId: 'demo-visit-k8', typeId: 'emission-current', phase: 'as-found', value: 20e-6, entered: { text: '20', unit: 'µA' }, context: { walkStep: 'no-signal/NS3E1' } });
    });
    const row = await waitFor(() => [...host.querySelectorAll('[data-testid="reading-row"]')].find((r) => r.textContent?.includes('diagnosis walk: ')), 'the walk reading with its step named');
    expect(row.textContent).toContain('diagnosis walk: No signal at all, “Is the emission current at its set point?”');
  });

  it('builds the maker-limit and own-type forms when their cards first open, and a limit saved there is counted', async () => {
    const host = await mount('/visits');
    const limits = await waitFor(() => host.querySelector<HTMLDetailsElement>('[data-testid="maker-limits"]'), 'the maker-limits card');
    expect(limits.querySelector('form')).toBeNull();
    expect(host.querySelector('[data-testid="own-type"] form')).toBeNull();
    await openDisclosure(host, 'maker-limits');
    await waitFor(() => limits.querySelector('#limit-source'), 'the limit form');
    await act(async () => {
      type(limits.querySelector('#limit-low'), '1');
      type(limits.querySelector('#limit-high'), '2');
      type(limits.querySelector('#limit-source'), 'Site sheet 4, rev. 2');
    });
    await act(async () => { limits.querySelector('form')!.dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });
    await waitFor(() => limits.querySelector('summary')?.textContent?.includes('1 entered'), 'the saved limit counted');
    expect(limits.textContent).toContain('Site sheet 4, rev. 2');
    await openDisclosure(host, 'own-type');
    expect(host.querySelector('[data-testid="own-type"] #own-label')).not.toBeNull();
  });

  it('says so plainly when a visit does not exist', async () => {
    const host = await mount('/visits/visit-gone');
    await waitFor(() => /Visit not found/.test(host.textContent ?? ''));
  });
});
