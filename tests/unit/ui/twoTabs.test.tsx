// @vitest-environment happy-dom
// The same visit edited in two tabs: two store connections (two `openStore` on one fake-indexeddb database),
// each with its own visit form. The later save wins; every reading either tab added stays; input one tab kept
// as a draft is not deleted by the other tab's save.
import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { VisitForm } from '../../../src/ui/visits/VisitForm';
import { catalogueType, checkEntry, eraseStore, openStore, type Store, type Visit } from '../../../src/store';
import { freshName } from '../store/helpers';
import { waitFor } from '../waitFor';

const opened: Store[] = [];
let name = '';

afterEach(async () => {
  for (const host of document.body.children) render(null, host);
  document.body.innerHTML = '';
  while (opened.length) opened.pop()!.close();
  if (name) await eraseStore(name);
  name = '';
});

async function tab(): Promise<Store> {
  const s = await openStore(name);
  opened.push(s);
  return s;
}

async function addRf(store: Store, visitId: string, text: string) {
  const type = catalogueType('rf-amplitude')!;
  const e = checkEntry(type, text, 'Vpp-rod', { mz: '69' });
  if (!e.ok) throw new Error(JSON.stringify(e.errors));
  return store.addReading({ visitId, typeId: type.id, phase: 'as-found', value: e.value, entered: { text, unit: 'V p-p' }, context: e.context });
}

async function mountForm(store: Store, visit: Visit): Promise<HTMLElement & { notify: ReturnType<typeof vi.fn> }> {
  const host = Object.assign(document.createElement('div'), { notify: vi.fn() });
  document.body.appendChild(host);
  const ctx: AppContextValue = {
    store, storeProblem: null, instruments: await store.listInstruments(), instrument: null,
    selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify: host.notify,
  };
  await act(async () => { render(<AppContext.Provider value={ctx}><VisitForm visit={visit} instrumentId={visit.instrumentId} /></AppContext.Provider>, host); });
  await waitFor(() => host.querySelector('#visit-notes'), 'the visit form');
  return host;
}

async function type(host: HTMLElement, id: string, text: string) {
  const el = host.querySelector(`#${id}`) as HTMLTextAreaElement;
  await act(async () => {
    el.value = text;
    el.dispatchEvent(new Event('input', { bubbles: true }));
  });
}

const submit = (host: HTMLElement) =>
  act(async () => { host.querySelector('form')!.dispatchEvent(new Event('submit', { bubbles: true, cancelable: true })); });

describe('one visit edited in two tabs', () => {
  it('the later save wins, and no reading added in either tab is lost', async () => {
    name = freshName();
    const a = await tab();
    await a.loadDemo();
    const b = await tab();
    const visit = (await a.listVisits()).find((v) => !v.baseline)!;
    const before = await a.listReadings(visit.id);

    const formA = await mountForm(a, visit);
    const formB = await mountForm(b, visit);
    // Both tabs add a reading while their forms are open.
    const ra = await addRf(a, visit.id, '201.8');
    const rb = await addRf(b, visit.id, '202.4');
    await type(formA, 'visit-notes', 'Notes typed in tab A');
    await type(formB, 'visit-notes', 'Notes typed in tab B');
    await waitFor(async () => (await b.getDraft<{ notes: string }>(`visit-form:${visit.id}`))?.notes === 'Notes typed in tab B', 'tab B’s draft');

    await submit(formA);
    // "Visit saved." comes once the save and its draft clean-up are done.
    await waitFor(() => formA.notify.mock.calls.some((c) => c[0] === 'Visit saved.'), 'tab A’s save to finish');
    expect((await a.getVisit(visit.id))?.notes).toBe('Notes typed in tab A');
    // Tab A's save leaves the draft tab B kept since: B's input would survive a reload of B.
    expect((await b.getDraft<{ notes: string }>(`visit-form:${visit.id}`))?.notes).toBe('Notes typed in tab B');

    await submit(formB);
    await waitFor(() => formB.notify.mock.calls.some((c) => c[0] === 'Visit saved.'), 'tab B’s later save to finish');
    // The later save wins in both connections; the draft is gone once its own tab saved it.
    expect((await a.getVisit(visit.id))?.notes).toBe('Notes typed in tab B');
    expect(await a.getDraft(`visit-form:${visit.id}`)).toBeUndefined();
    // Every reading is still there, seen from either tab: the ones before, and one from each tab.
    for (const s of [a, b]) {
      const ids = (await s.listReadings(visit.id)).map((r) => r.id).sort();
      expect(ids).toEqual([...before.map((r) => r.id), ra.id, rb.id].sort());
    }
    // Saving the visit fields changed no reading.
    expect(await a.listReadings(visit.id)).toEqual(expect.arrayContaining([...before, ra, rb].map((r) => expect.objectContaining({ id: r.id, value: r.value }))));
  });

  it('a reading added in one tab after the other deleted the visit is refused with a message, not dropped silently', async () => {
    name = freshName();
    const a = await tab();
    await a.loadDemo();
    const b = await tab();
    const visit = (await a.listVisits()).find((v) => !v.baseline)!;
    const bundle = await a.deleteVisit(visit.id);
    await expect(addRf(b, visit.id, '201.8')).rejects.toThrow(/its visit no longer exists/);
    // Undo in tab A brings back the visit with every reading it had.
    await a.restoreVisit(bundle!);
    expect((await b.listReadings(visit.id)).map((r) => r.id)).toEqual(bundle!.readings.map((r) => r.id));
  });
});
