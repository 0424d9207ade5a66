// What every screen may need: the open store, the instrument profiles and the one the user is working on.
import { createContext } from 'preact';
import { useContext } from 'preact/hooks';
import type { InstrumentProfile, Store } from '../store';

export interface AppContextValue {
  store: Store | null;
  /** A sentence to show when the database could not be opened. */
  storeProblem: string | null;
  instruments: InstrumentProfile[];
  instrument: InstrumentProfile | null;
  selectInstrument(id: string): void;
  reloadInstruments(): Promise<void>;
  /** Short message shown for a few seconds, with an optional action (e.g. Undo). */
  notify(message: string, action?: { label: string; run: () => void }): void;
  /** True while a first start's demo visits are still being written (its instruments are there already). */
  demoLoading?: boolean;
}

export const AppContext = createContext<AppContextValue>({
  store: null,
  storeProblem: null,
  instruments: [],
  instrument: null,
  selectInstrument: () => undefined,
  reloadInstruments: async () => undefined,
  notify: () => undefined,
});

export function useApp(): AppContextValue {
  return useContext(AppContext);
}
