// Renders a screen inside the app context with a demo instrument and an in-memory stand-in for the store's
// settings (and the visit log's noteReading), so component tests see the same inputs path as the app.
import { render, type ComponentChildren } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { demoInstruments } from '../../../src/store/demo';
import type { InstrumentProfile, Store } from '../../../src/store';

export interface Harness {
  root: HTMLElement;
  settings: Map<string, unknown>;
  notes: unknown[];
  messages: string[];
  unmount(): void;
}

export function demo(id: 'kestrel' | 'heron' | 'wren'): InstrumentProfile {
  const p = demoInstruments.find((d) => d.id.endsWith(id));
  if (!p) throw new Error(`no demo ${id}`);
  return p;
}

export async function mount(children: ComponentChildren, instrument: InstrumentProfile, kept: Record<string, unknown> = {}, realStore?: Store): Promise<Harness> {
  const settings = new Map<string, unknown>(Object.entries(kept));
  const notes: unknown[] = [];
  const messages: string[] = [];
  const store = realStore ?? ({
    name: 'test',
    getSetting: async (key: string) => settings.get(key),
    setSetting: async (key: string, value: unknown) => void settings.set(key, value),
    noteReading: async (_i: InstrumentProfile, n: unknown) => {
      notes.push(n);
      return { visitLabel: 'the test visit' };
    },
  } as unknown as Store);
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
  await settle();
  return { root, settings, notes, messages, unmount: () => { render(null, root); root.remove(); } };
}

export async function settle(): Promise<void> {
  for (let i = 0; i < 3; i++) {
    await act(async () => {
      await new Promise((r) => setTimeout(r, 0));
    });
  }
}

/** Type into the input labelled `label` (exact label text start), firing an input event. */
export async function typeInto(root: HTMLElement, id: string, text: string): Promise<void> {
  const el = root.querySelector<HTMLInputElement | HTMLSelectElement>(`#${CSS.escape(id)}`);
  if (!el) throw new Error(`no field #${id}`);
  await act(async () => {
    el.value = text;
    el.dispatchEvent(new Event(el instanceof HTMLSelectElement ? 'change' : 'input', { bubbles: true }));
  });
  await settle();
}

export function texts(root: ParentNode, selector: string): string[] {
  return [...root.querySelectorAll(selector)].map((e) => (e.textContent ?? '').replace(/\s+/g, ' ').trim());
}
