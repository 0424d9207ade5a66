// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { DiagnoseScreen, LEAK_DRAFT_KEY, type WalkDraft } from '../../../src/ui/screens/DiagnoseScreen';
import { parseNumber } from '../../../src/ui/screens/diagnose/parse';
import { answer, start, treeById } from '../../../src/diagnose';
import { StoreError, demoInstruments, eraseStore, openStore, type Store, type WalkRecord } from '../../../src/store';
import { freshName } from '../store/helpers';
import { waitFor } from '../waitFor';

interface Saved { id?: string; status: string; state: unknown; treeId: string; instrumentId?: string }

let open: { store: Store; name: string } | null = null;

/** The real store on fake-indexeddb, with every saveWalk call recorded (the real method still runs). */
async function realStore(opts: { latest?: Omit<WalkRecord, 'id' | 'startedAt' | 'updatedAt'>; failSave?: boolean } = {}) {
  const name = freshName();
  const store = await openStore(name);
  for (const p of demoInstruments) await store.restoreInstrument(p);
  open = { store, name };
  const latest = opts.latest ? await store.saveWalk(opts.latest) : undefined;
  const saves: Saved[] = [];
  const real = store.saveWalk.bind(store);
  vi.spyOn(store, 'saveWalk').mockImplementation(async (w) => {
    if (opts.failSave) throw new StoreError('The device is full: the walk could not be kept.');
    saves.push(JSON.parse(JSON.stringify(w)));
    return real(w);
  });
  const walks = () => store.db.getAll('walks');
  return { store, saves, latest, walks };
}

async function mount(store: Store, notify = vi.fn(), path = '/diagnose'): Promise<HTMLElement> {
  history.pushState(null, '', path);
  const host = document.createElement('div');
  document.body.appendChild(host);
  const ctx: AppContextValue = {
    store, storeProblem: null, instruments: [...demoInstruments], instrument: path === '/diagnose' ? demoInstruments[0] : null,
    selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify,
  };
  await act(async () => { render(<AppContext.Provider value={ctx}><DiagnoseScreen /></AppContext.Provider>, host); });
  return host;
}

const saveState = (host: HTMLElement) => host.querySelector('[data-testid="save-state"]')?.textContent ?? '';
/** The walk is on screen and every save asked for so far has landed. */
const kept = (host: HTMLElement) => waitFor(() => /✓ kept on this device/.test(saveState(host)), 'the walk to be kept');

function button(host: HTMLElement, text: string | RegExp): HTMLButtonElement {
  const b = [...host.querySelectorAll('button')].find((x) => (typeof text === 'string' ? x.textContent?.includes(text) : text.test(x.textContent ?? '')));
  if (!b) throw new Error(`no button ${text}; text: ${host.textContent?.slice(0, 200)}; have: ${[...host.querySelectorAll('button')].map((x) => x.textContent).join(' | ')}`);
  return b as HTMLButtonElement;
}

const nodeOf = (host: HTMLElement) => host.querySelector('[data-testid="walk-node"]')?.getAttribute('data-node-id');

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
    const { store, saves, walks } = await realStore();
    const host = await mount(store);
    const target = await waitFor(() => button(host, 'Start a walk'), 'the start button');
    await act(async () => target.click());
    await kept(host);
    expect(nodeOf(host)).toBe('E1');
    expect(saves[0]).toMatchObject({ status: 'in-progress', treeId: 'entry', instrumentId: demoInstruments[0].id });
    expect(saves[0].id).toBeUndefined();
    const [record] = await walks();
    // Refusing the gate is always possible and leads to the stop leaf.
    await act(async () => button(host, 'I cannot confirm').click());
    await waitFor(() => nodeOf(host) === 'E-stop', 'the stop leaf');
    await kept(host);
    expect(saves.at(-1)!.id).toBe(record.id);
    expect(saves.filter((s) => s.id === undefined)).toHaveLength(1);
    const all = await walks();
    expect(all).toHaveLength(1);
    expect(all[0]).toMatchObject({ id: record.id, state: { walk: { nodeId: 'E-stop' } } });
    expect(host.textContent).toMatch(/Then re-measure and record/);
  });

  it('going straight to one symptom still passes the shared safety gate, then says the as-found record was skipped', async () => {
    const { store, saves, walks } = await realStore();
    const host = await mount(store);
    const target = await waitFor(() => button(host, treeById('sensitivity').title), 'the symptom buttons');
    await act(async () => target.click());
    await kept(host);
    expect(nodeOf(host)).toBe('E1');
    expect(host.textContent).toContain(`then: ${treeById('sensitivity').title}`);
    expect(saves[0]).toMatchObject({ treeId: 'entry', state: { walk: { direct: 'sensitivity', nodeId: 'E1' } } });
    const radios = [...host.querySelectorAll('input[type="radio"]')] as HTMLInputElement[];
    await act(async () => radios[0].click());
    for (let i = 0; i < 4; i++) {
      const box = host.querySelectorAll('input[type="checkbox"]')[i] as HTMLInputElement;
      await act(async () => box.click());
    }
    const confirm = await waitFor(() => button(host, 'Confirmed — continue'), 'the confirm button');
    await act(async () => confirm.click());
    await waitFor(() => nodeOf(host) === 'hand-over', 'the hand-over node');
    expect(host.querySelector('[data-testid="as-found-skipped"]')?.textContent).toMatch(/as-found record .* is skipped\. It is optional/);
    await act(async () => button(host, `Start “${treeById('sensitivity').title}”`).click());
    await waitFor(() => nodeOf(host) === treeById('sensitivity').entry, 'the symptom tree entry');
    expect(host.querySelector('[data-testid="as-found-skipped"]')).toBeNull();
    await kept(host);
    const all = await walks();
    expect(all).toHaveLength(1);
    expect(saves.at(-1)).toMatchObject({ id: all[0].id, treeId: 'sensitivity' });
  });

  it('resumes the latest walk in progress at the same step', async () => {
    const ns = treeById('no-signal');
    let walk = start(ns, demoInstruments[0]);
    walk = answer(walk, ns, { kind: 'option', optionId: 'nothing' });
    const state: WalkDraft = { walk, typed: { 'no-signal/NS2': { value: '1.2e-5' } }, finished: false };
    const { store, saves, latest } = await realStore({ latest: { treeId: 'no-signal', state, status: 'in-progress', instrumentId: demoInstruments[0].id } });
    const host = await mount(store);
    await waitFor(() => nodeOf(host) === 'NS2', 'the resumed step NS2');
    expect(host.querySelector('[data-testid="resumed"]')).not.toBeNull();
    expect((host.querySelector('#walk-value') as HTMLInputElement).value).toBe('1.2e-5');
    await act(async () => button(host, 'Back').click());
    await waitFor(() => nodeOf(host) === 'NS1', 'the step back to NS1');
    await kept(host);
    expect(saves.at(-1)!.id).toBe(latest!.id);
  });

  it('keeps an unreadable walk record and says so', async () => {
    const { store, saves, latest, walks } = await realStore({ latest: { treeId: 'no-signal', state: { something: 'else' }, status: 'in-progress' } });
    const host = await mount(store);
    await waitFor(() => /could not be read here\. It is kept on this device/.test(host.textContent ?? ''), 'the unreadable-walk notice');
    await act(async () => button(host, 'Start a walk').click());
    await kept(host);
    expect(saves[0].id).toBeUndefined();
    // The unreadable record is still there, beside the new walk.
    expect((await walks()).map((w) => w.id)).toContain(latest!.id);
  });

  it('tells the user when the walk cannot be kept, and keeps walking on screen', async () => {
    const { store } = await realStore({ failSave: true });
    const notify = vi.fn();
    const host = await mount(store, notify);
    const target = await waitFor(() => button(host, 'Start a walk'), 'the start button');
    await act(async () => target.click());
    await waitFor(() => /✗ not saved/.test(saveState(host)), 'the “not saved” mark');
    expect(nodeOf(host)).toBe('E1');
    expect(notify).toHaveBeenCalledWith('The device is full: the walk could not be kept.');
  });

  it('the leak check panel names a bad height and calls an air leak from good ones', async () => {
    const { store } = await realStore();
    const host = await mount(store, vi.fn(), '/diagnose/leak-check');
    await waitFor(() => host.querySelector('#leak-m28'), 'the leak check fields');
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
    // What was typed is kept on the device as the leak check's draft.
    await waitFor(async () => JSON.stringify(await store.getDraft(LEAK_DRAFT_KEY)).includes('17'), 'the kept leak check input');
  });

  it('the leak check panel shows the tracer-gas card before the spraying steps and the m/z 4 fields', async () => {
    const { store } = await realStore();
    const host = await mount(store, vi.fn(), '/diagnose/leak-check');
    await waitFor(() => host.querySelector('[data-testid="tracer-caution"]'), 'the tracer-gas card');
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
