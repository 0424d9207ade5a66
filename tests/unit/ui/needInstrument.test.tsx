// @vitest-environment happy-dom
// A screen with no instrument: while the records are still opening it holds the space of a screen (nothing jumps
// when results arrive); once they are open it asks the user to pick or add one.
import { afterEach, describe, expect, it } from 'vitest';
import { render } from 'preact';
import { act } from 'preact/test-utils';
import { AppContext, type AppContextValue } from '../../../src/ui/context';
import { NeedInstrument } from '../../../src/ui/components/NeedInstrument';
import type { Store } from '../../../src/store';

const base: AppContextValue = {
  store: null, storeProblem: null, instruments: [], instrument: null,
  selectInstrument: () => undefined, reloadInstruments: async () => undefined, notify: () => undefined,
};

let host: HTMLElement | null = null;
afterEach(() => {
  if (host) render(null, host);
  host?.remove();
  host = null;
});

async function show(ctx: Partial<AppContextValue>): Promise<HTMLElement> {
  host = document.createElement('div');
  document.body.appendChild(host);
  await act(async () => render(<AppContext.Provider value={{ ...base, ...ctx }}><NeedInstrument>Pick or add an instrument first.</NeedInstrument></AppContext.Provider>, host!));
  return host;
}

describe('NeedInstrument', () => {
  it('while the records open: a busy placeholder, no "add an instrument" yet', async () => {
    const el = await show({});
    expect(el.querySelector('[data-testid="instrument-pending"]')?.getAttribute('aria-busy')).toBe('true');
    expect(el.textContent).not.toMatch(/Add an instrument/);
  });

  it('once open with no instrument: the request and the link to add one', async () => {
    const el = await show({ store: {} as Store });
    expect(el.querySelector('[data-testid="instrument-pending"]')).toBeNull();
    expect(el.textContent).toMatch(/Pick or add an instrument first\. Add an instrument/);
    expect(el.querySelector('a[href="/instruments/new"]')).not.toBeNull();
  });

  it('when the records could not be opened: the request, not an endless wait', async () => {
    const el = await show({ storeProblem: 'The database could not be opened.' });
    expect(el.querySelector('[data-testid="instrument-pending"]')).toBeNull();
    expect(el.textContent).toMatch(/Add an instrument/);
  });
});
