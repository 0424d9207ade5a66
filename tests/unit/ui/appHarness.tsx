// Renders a screen inside the app context with a demo instrument and the real store on fake-indexeddb (a fresh
// database per mount, closed and deleted by unmount), so component tests see the same inputs path as the app.
import 'fake-indexeddb/auto';
import { render, type ComponentChildren } from 'preact';
import { act } from 'preact/test-utils';
import { vi } from 'vitest';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { demoInstruments } from '../../../src/store/demo';
import { eraseStore, openStore, type InstrumentProfile, type Store } from '../../../src/store';
import { freshName } from '../store/helpers';
import { waitFor } from '../waitFor';

export { waitFor };

export interface Harness {
  root: HTMLElement;
  store: Store;
  /** What screens handed to the store's noteReading (the real method still runs). */
  notes: unknown[];
  messages: string[];
  /** Wait until the store holds a setting that satisfies `check`, and return it. */
  setting<T = unknown>(key: string, check?: (value: T | undefined) => boolean): Promise<T | undefined>;
  unmount(): Promise<void>;
}

export function demo(id: 'kestrel' | 'heron' | 'wren'): InstrumentProfile {
  const p = demoInstruments.find((d) => d.id.endsWith(id));
  if (!p) throw new Error(`no demo ${id}`);
  return p;
}

/**
 * Mount `children` with `instrument` selected. `kept` settings are written to the store first. With `given`,
 * that store is used (and left open); otherwise a fresh database holding the three demo profiles.
 */
export async function mount(children: ComponentChildren, instrument: InstrumentProfile, kept: Record<string, unknown> = {}, given?: Store): Promise<Harness> {
  const name = given ? null : freshName();
  const store = given ?? (await openStore(name!));
  if (!given) for (const p of demoInstruments) await store.restoreInstrument(p);
  for (const [key, value] of Object.entries(kept)) await store.setSetting(key, value);
  const notes: unknown[] = [];
  const messages: string[] = [];
  const real = store.noteReading.bind(store);
  const spy = vi.spyOn(store, 'noteReading').mockImplementation(async (i, n) => {
    notes.push(n);
    return real(i, n);
  });
  const ctx: AppContextValue = {
    store,
    storeProblem: null,
    instruments: [...demoInstruments],
    instrument,
    selectInstrument: () => undefined,
    reloadInstruments: async () => undefined,
    notify: (m) => void messages.push(m),
  };
  const root = document.createElement('div');
  document.body.appendChild(root);
  await act(async () => {
    render(<AppContext.Provider value={ctx}>{children}</AppContext.Provider>, root);
  });
  // Sections below the answer join a task later (Later in Fold.tsx): wait for them as the eye does.
  await waitFor(() => !root.querySelector('[data-later]'), 'the sections below the answer');
  return {
    root, store, notes, messages,
    setting: <T,>(key: string, check: (value: T | undefined) => boolean = (v) => v !== undefined) =>
      waitFor(async () => {
        const v = await store.getSetting<T>(key);
        return check(v) ? { v } : null;
      }, `the setting ${key}`).then((r) => r!.v),
    unmount: async () => {
      render(null, root);
      root.remove();
      spy.mockRestore();
      if (name) {
        store.close();
        await eraseStore(name);
      }
    },
  };
}

/** Type into the field with id `id`, firing an input (or, for a select, change) event. */
export async function typeInto(root: HTMLElement, id: string, text: string): Promise<void> {
  // Folded fields join the page a task after the first draw (Fold.tsx): wait for the field as a user's eye does.
  const el = await waitFor(() => root.querySelector<HTMLInputElement | HTMLSelectElement>(`#${CSS.escape(id)}`), `the field #${id}`);
  await act(async () => {
    el.value = text;
    el.dispatchEvent(new Event(el instanceof HTMLSelectElement ? 'change' : 'input', { bubbles: true }));
  });
}

/**
 * Open a closed disclosure as a user does, by tapping its summary: `which` is the disclosure's data-testid or
 * part of its summary text. What a closed disclosure holds is built when it first opens (Fold.tsx).
 */
export async function openDisclosure(root: HTMLElement, which: string): Promise<HTMLDetailsElement> {
  const all = [...root.querySelectorAll<HTMLDetailsElement>('details')];
  const found = all.find((d) => d.dataset.testid === which) ?? all.find((d) => d.querySelector('summary')?.textContent?.includes(which));
  if (!found) throw new Error(`no disclosure "${which}"`);
  if (!found.open) await act(async () => found.querySelector('summary')!.click());
  await waitFor(() => found.open && (found.lastElementChild?.childNodes.length ?? 0) > 0, `the disclosure "${which}" open with its content`);
  return found;
}

export function texts(root: ParentNode, selector: string): string[] {
  return [...root.querySelectorAll(selector)].map((e) => (e.textContent ?? '').replace(/\s+/g, ' ').trim());
}
