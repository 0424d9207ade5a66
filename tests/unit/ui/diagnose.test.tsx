// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { DiagnoseScreen, type WalkDraft } from '../../../src/ui/screens/DiagnoseScreen';
import { parseNumber } from '../../../src/ui/screens/diagnose/parse';
import { answer, start, treeById } from '../../../src/diagnose';
import { demoInstruments, type Store, type WalkRecord } from '../../../src/store';

interface Saved { id?: string; status: string; state: unknown; treeId: string; instrumentId?: string }

function fakeStore(opts: { latest?: WalkRecord; failSave?: boolean } = {}) {
  const saves: Saved[] = [];
  let n = 0;
  const store = {
    getDraft: async () => undefined,
    putDraft: async () => undefined,
    clearDraft: async () => undefined,
    latestInProgressWalk: async () => opts.latest,
    saveWalk: async (w: Saved) => {
      if (opts.failSave) throw Object.assign(new Error('quota'), { userMessage: 'The device is full: the walk could not be kept.' });
      saves.push(JSON.parse(JSON.stringify(w)));
      return { ...w, id: w.id ?? `walk-${++n}`, startedAt: 'x', updatedAt: 'x' };
    },
  } as unknown as Store;
  return { store, saves };
}

function mount(store: Store, notify = vi.fn()): HTMLElement {
  history.pushState(null, '', '/diagnose');
  const host = document.createElement('div');
  document.body.appendChild(host);
  const ctx: AppContextValue = {
    store, storeProblem: null, instruments: [...demoInstruments], instrument: demoInstruments[0],
    selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify,
  };
  render(<AppContext.Provider value={ctx}><DiagnoseScreen /></AppContext.Provider>, host);
  return host;
}

async function settle() {
  for (let i = 0; i < 8; i++) await act(async () => { await new Promise((r) => setTimeout(r, 0)); });
}

function button(host: HTMLElement, text: string | RegExp): HTMLButtonElement {
  const b = [...host.querySelectorAll('button')].find((x) => (typeof text === 'string' ? x.textContent?.includes(text) : text.test(x.textContent ?? '')));
  if (!b) throw new Error(`no button ${text}; have: ${[...host.querySelectorAll('button')].map((x) => x.textContent).join(' | ')}`);
  return b as HTMLButtonElement;
}

const nodeOf = (host: HTMLElement) => host.querySelector('[data-testid="walk-node"]')?.getAttribute('data-node-id');

afterEach(() => {
  document.body.innerHTML = '';
});

describe('parseNumber', () => {
  it('reads decimal comma, exponents and ×10^ notation', () => {
    expect(parseNumber('2,5', 'x')).toEqual({ ok: true, value: 2.5 });
    expect(parseNumber(' 1.5e-5 ', 'x')).toEqual({ ok: true, value: 1.5e-5 });
    expect(parseNumber('1.5×10^-5', 'x')).toEqual({ ok: true, value: 1.5e-5 });
    expect(parseNumber('−3', 'x')).toEqual({ ok: true, value: -3 });
  });
  it('names the field for empty or bad text, never NaN', () => {
    expect(parseNumber('', 'Emission current')).toEqual({ ok: false, message: 'Enter Emission current.' });
    expect(parseNumber('12abc', 'Emission current')).toEqual({ ok: false, message: 'Emission current must be a number, e.g. 2.5 or 2.5e-5.' });
    expect(parseNumber('1e999', 'x')).toEqual({ ok: false, message: 'x must be a finite number.' });
  });
});

describe('DiagnoseScreen', () => {
  it('starts a walk and keeps every step in one walk record, in order', async () => {
    const { store, saves } = fakeStore();
    const host = mount(store);
    await settle();
    await act(async () => button(host, 'Start a walk').click());
    await settle();
    expect(nodeOf(host)).toBe('E1');
    expect(host.querySelector('[data-testid="save-state"]')?.textContent).toMatch(/✓ kept on this device/);
    expect(saves[0]).toMatchObject({ status: 'in-progress', treeId: 'entry', instrumentId: demoInstruments[0].id });
    expect(saves[0].id).toBeUndefined();
    // Refusing the gate is always possible and leads to the stop leaf.
    await act(async () => button(host, 'I cannot confirm').click());
    await settle();
    expect(nodeOf(host)).toBe('E-stop');
    expect(saves.at(-1)!.id).toBe('walk-1');
    expect(saves.filter((s) => s.id === undefined)).toHaveLength(1);
    expect(host.textContent).toMatch(/Then re-measure and record/);
  });

  it('going straight to one symptom still passes the shared safety gate, then says the as-found record was skipped', async () => {
    const { store, saves } = fakeStore();
    const host = mount(store);
    await settle();
    await act(async () => button(host, treeById('sensitivity').title).click());
    await settle();
    expect(nodeOf(host)).toBe('E1');
    expect(host.textContent).toContain(`then: ${treeById('sensitivity').title}`);
    expect(saves[0]).toMatchObject({ treeId: 'entry', state: { walk: { direct: 'sensitivity', nodeId: 'E1' } } });
    const radios = [...host.querySelectorAll('input[type="radio"]')] as HTMLInputElement[];
    await act(async () => radios[0].click());
    for (let i = 0; i < 4; i++) {
      const box = host.querySelectorAll('input[type="checkbox"]')[i] as HTMLInputElement;
      await act(async () => box.click());
    }
    await settle();
    await act(async () => button(host, 'Confirmed — continue').click());
    await settle();
    expect(nodeOf(host)).toBe('hand-over');
    expect(host.querySelector('[data-testid="as-found-skipped"]')?.textContent).toMatch(/as-found record .* is skipped\. It is optional/);
    await act(async () => button(host, `Start “${treeById('sensitivity').title}”`).click());
    await settle();
    expect(nodeOf(host)).toBe(treeById('sensitivity').entry);
    expect(host.querySelector('[data-testid="as-found-skipped"]')).toBeNull();
    expect(saves.at(-1)).toMatchObject({ id: 'walk-1', treeId: 'sensitivity' });
  });

  it('resumes the latest walk in progress at the same step', async () => {
    const ns = treeById('no-signal');
    let walk = start(ns, demoInstruments[0]);
    walk = answer(walk, ns, { kind: 'option', optionId: 'nothing' });
    const state: WalkDraft = { walk, typed: { 'no-signal/NS2': { value: '1.2e-5' } }, finished: false };
    const latest: WalkRecord = { id: 'walk-7', treeId: 'no-signal', state, status: 'in-progress', startedAt: walk.startedAt, updatedAt: walk.updatedAt };
    const { store, saves } = fakeStore({ latest });
    const host = mount(store);
    await settle();
    expect(nodeOf(host)).toBe('NS2');
    expect(host.querySelector('[data-testid="resumed"]')).not.toBeNull();
    expect((host.querySelector('#walk-value') as HTMLInputElement).value).toBe('1.2e-5');
    await act(async () => button(host, 'Back').click());
    await settle();
    expect(nodeOf(host)).toBe('NS1');
    expect(saves.at(-1)!.id).toBe('walk-7');
  });

  it('keeps an unreadable walk record and says so', async () => {
    const latest: WalkRecord = { id: 'walk-9', treeId: 'no-signal', state: { something: 'else' }, status: 'in-progress', startedAt: '2026-01-01T00:00:00.000Z', updatedAt: '2026-01-01T00:00:00.000Z' };
    const { store, saves } = fakeStore({ latest });
    const host = mount(store);
    await settle();
    expect(host.textContent).toMatch(/could not be read here\. It is kept on this device/);
    await act(async () => button(host, 'Start a walk').click());
    await settle();
    expect(saves[0].id).toBeUndefined();
  });

  it('tells the user when the walk cannot be kept, and keeps walking on screen', async () => {
    const { store } = fakeStore({ failSave: true });
    const notify = vi.fn();
    const host = mount(store, notify);
    await settle();
    await act(async () => button(host, 'Start a walk').click());
    await settle();
    expect(nodeOf(host)).toBe('E1');
    expect(notify).toHaveBeenCalledWith('The device is full: the walk could not be kept.');
    expect(host.querySelector('[data-testid="save-state"]')?.textContent).toMatch(/✗ not saved/);
  });

  it('the leak check panel names a bad height and calls an air leak from good ones', async () => {
    const { store } = fakeStore();
    history.pushState(null, '', '/diagnose/leak-check');
    const host = document.createElement('div');
    document.body.appendChild(host);
    const ctx: AppContextValue = {
      store, storeProblem: null, instruments: [], instrument: null,
      selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify: vi.fn(),
    };
    render(<AppContext.Provider value={ctx}><DiagnoseScreen /></AppContext.Provider>, host);
    await settle();
    const type = async (id: string, text: string) => {
      const el = host.querySelector(id) as HTMLInputElement;
      el.value = text;
      await act(async () => { el.dispatchEvent(new Event('input', { bubbles: true })); });
    };
    await type('#leak-m28', '1000');
    await type('#leak-m32', 'x');
    // Refused on leaving the field, with the message tied to it.
    await act(async () => { host.querySelector('#leak-m32')!.dispatchEvent(new Event('blur')); });
    expect(host.textContent).toMatch(/Height at m\/z 32 must be a number between 0 and 1e15/);
    expect(host.querySelector('#leak-m32')!.getAttribute('aria-invalid')).toBe('true');
    expect(host.querySelector('#leak-m32')!.getAttribute('aria-describedby')).toBe('leak-m32-error');
    await type('#leak-m32', '260');
    await type('#leak-m40', '17');
    expect(host.querySelector('[data-testid="leak-indication"]')?.textContent).toMatch(/Air leak/);
    expect(host.textContent).not.toMatch(/NaN/);
  });

  it('the leak check panel shows the tracer-gas card before the spraying steps and the m/z 4 fields', async () => {
    const { store } = fakeStore();
    history.pushState(null, '', '/diagnose/leak-check');
    const host = document.createElement('div');
    document.body.appendChild(host);
    const ctx: AppContextValue = {
      store, storeProblem: null, instruments: [], instrument: null,
      selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify: vi.fn(),
    };
    render(<AppContext.Provider value={ctx}><DiagnoseScreen /></AppContext.Provider>, host);
    await settle();
    const caution = host.querySelector('[data-testid="tracer-caution"]');
    const steps = host.querySelector('[data-testid="tracer-steps"]');
    const heField = host.querySelector('#leak-he0');
    expect(caution && steps && heField).toBeTruthy();
    // Document order: card, then the spraying steps, then the tracer fields.
    expect(caution!.compareDocumentPosition(steps!) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(steps!.compareDocumentPosition(heField!) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    const card = caution!.textContent ?? '';
    expect(card).toMatch(/Tracer gas spraying/);
    expect(card).toMatch(/HV feedthroughs/);
    expect(card).toMatch(/confined/);
    expect(card).toMatch(/Never use a flammable tracer/);
    expect(card).toMatch(/maker's procedures/);
    expect(steps!.textContent).toMatch(/Spray one short burst/);
  });
});
