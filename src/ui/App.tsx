import { useCallback, useEffect, useMemo, useRef, useState } from 'preact/hooks';
import { isotopeRatioM1 } from '../spectrum';
import { defaultEngine, openStore, type EngineFunctions, type InstrumentProfile, type Store } from '../store';
import { areaForPath, areas } from './areas';
import { AppContext, useApp, type AppContextValue } from './context';
import { UpdateBanner } from './components/UpdateBanner';
import { FieldModeToggle } from './components/FieldModeToggle';
import { usePath } from './router';
import { holdStartUp } from './startUp';
import { routeFor } from './routes';
import { errorText, storeSentence } from './errorText';

/**
 * The store's physics: the engine's scan law, and isotope ratios from ion formulas for the calibrant check (each
 * formula's pattern worked out once: judging a visit asks for the same calibrant ions again and again).
 */
const isotopeM1Cache = new Map<string, ReturnType<typeof isotopeRatioM1>>();
const storeEngine: EngineFunctions = {
  ...defaultEngine,
  isotopeM1: (formula) => {
    let known = isotopeM1Cache.get(formula);
    if (!known) isotopeM1Cache.set(formula, (known = isotopeRatioM1(formula)));
    return { ...known };
  },
};

interface Toast {
  id: number;
  message: string;
  action?: { label: string; run: () => void };
}

const CURRENT_INSTRUMENT_KEY = 'currentInstrumentId';

export function App() {
  const path = usePath();
  const [store, setStore] = useState<Store | null>(null);
  const [storeProblem, setStoreProblem] = useState<string | null>(null);
  const [instruments, setInstruments] = useState<InstrumentProfile[]>([]);
  const [currentId, setCurrentId] = useState<string | null>(null);
  const [toast, setToast] = useState<Toast | null>(null);
  const toastTimer = useRef<number | undefined>(undefined);
  // Bumped when the page comes back from the back/forward cache: the database is opened afresh.
  const [opening, setOpening] = useState(0);
  // True while the demo visits of a first start are still being written (the instruments are there already).
  const [demoLoading, setDemoLoading] = useState(false);

  const notify = useCallback((message: string, action?: Toast['action']) => {
    window.clearTimeout(toastTimer.current);
    setToast({ id: Date.now(), message, action });
    toastTimer.current = window.setTimeout(() => setToast(null), action ? 8000 : 4000);
  }, []);

  useEffect(() => {
    let cancelled = false;
    // Work that waits for the first screen (the offline copy of the app) waits for its data.
    const release = holdStartUp('database');
    (async () => {
      try {
        const s = await openStore(undefined, {
          onBlocked: () =>
            setStoreProblem('Rodside is open in another tab with an older version. Close that tab (or reload it) so this one can finish updating your data.'),
          onVersionChange: () =>
            setStoreProblem('A newer version of Rodside opened in another tab. Reload this tab to keep working; anything typed here is kept as a draft.'),
        }, { engine: storeEngine });
        if (cancelled) { s.close(); return; }
        // On a first start the screen waits for the demo instruments only; the demo visits, each reading judged in
        // a task of its own, follow while it draws (the Visits screen says it is loading them meanwhile).
        let instrumentsIn: () => void = () => undefined;
        const written = new Promise<void>((resolve) => { instrumentsIn = resolve; });
        const demo = opening === 0 ? s.loadDemo(false, instrumentsIn) : null;
        let demoSettled = !demo;
        if (demo) {
          demo.then(() => { demoSettled = true; }, () => { demoSettled = true; });
          await Promise.race([written, demo]);
        }
        const list = await s.listInstruments();
        const saved = await s.getSetting<string>(CURRENT_INSTRUMENT_KEY);
        if (demo && !demoSettled && !cancelled) {
          setDemoLoading(true);
          const releaseDemo = holdStartUp('demo visits');
          demo
            .catch((err: unknown) => {
              // A page put away (back/forward cache) has its writes aborted: quiet, the rest loads next time.
              if (!cancelled && document.visibilityState !== 'hidden') notify(`The demo visits could not all be loaded (${errorText(err)}); the rest is loaded at the next start.`);
            })
            .finally(() => {
              releaseDemo();
              if (!cancelled) setDemoLoading(false);
            });
        }
        setStore(s);
        setInstruments(list);
        setCurrentId(saved && list.some((p) => p.id === saved) ? saved : (list[0]?.id ?? null));
      } catch (err) {
        setStoreProblem(storeSentence(err) ?? `The database could not be opened: ${String(err)}`);
      } finally {
        release();
      }
    })();
    return () => {
      cancelled = true;
      release();
    };
  }, [opening, notify]);

  // A page kept in the back/forward cache must not hold its database: the page that replaces it (or a newer
  // version's upgrade) would wait on it. When the page is hidden the connection is closed and what it still runs
  // is aborted (see Store.suspend); shown again from the cache, it opens the database afresh.
  useEffect(() => {
    if (!store) return;
    const hide = (e: PageTransitionEvent): void => store.suspend(e.persisted ? 'cached' : 'unload');
    const show = (e: PageTransitionEvent): void => {
      if (e.persisted) setOpening((n) => n + 1);
    };
    window.addEventListener('pagehide', hide);
    window.addEventListener('pageshow', show);
    return () => {
      window.removeEventListener('pagehide', hide);
      window.removeEventListener('pageshow', show);
    };
  }, [store]);

  const reloadInstruments = useCallback(async () => {
    if (!store) return;
    const list = await store.listInstruments();
    setInstruments(list);
    setCurrentId((id) => (id && list.some((p) => p.id === id) ? id : (list[0]?.id ?? null)));
  }, [store]);

  const selectInstrument = useCallback(
    (id: string) => {
      setCurrentId(id);
      // The choice holds for this session either way; if it cannot be kept, say that a reload will forget it.
      void store?.setSetting(CURRENT_INSTRUMENT_KEY, id).catch((err: unknown) =>
        notify(`This profile is chosen for now, but the choice could not be kept on this device: ${errorText(err)}`));
    },
    [store, notify],
  );

  const ctx: AppContextValue = useMemo(
    () => ({
      store,
      storeProblem,
      instruments,
      instrument: instruments.find((p) => p.id === currentId) ?? null,
      selectInstrument,
      reloadInstruments,
      notify,
      demoLoading,
    }),
    [store, storeProblem, instruments, currentId, selectInstrument, reloadInstruments, notify, demoLoading],
  );

  const area = areaForPath(path);
  const Screen = routeFor(path);

  useEffect(() => {
    document.title = area.id === 'home' ? 'Rodside' : `${area.title} · Rodside`;
  }, [area]);

  return (
    <AppContext.Provider value={ctx}>
      <a class="skip-link" href="#main">Skip to content</a>
      <header class="topbar">
        <a class="brand" href="/" aria-label="Rodside overview">
          <span class="brand-mark" aria-hidden="true" />
          <span class="brand-name">Rodside</span>
        </a>
        <InstrumentPicker />
        <FieldModeToggle />
      </header>
      <UpdateBanner />
      {storeProblem && (
        <div class="banner banner-problem" role="alert">
          <strong>Storage:</strong> {storeProblem}
        </div>
      )}
      <div class="frame">
        <nav class="rail" aria-label="Areas">
          {areas.map((a) => (
            <a key={a.id} href={a.path} class={a.id === area.id ? 'rail-link active' : 'rail-link'} aria-current={a.id === area.id ? 'page' : undefined}>
              <a.icon />
              <span>{a.title}</span>
            </a>
          ))}
        </nav>
        <main id="main" tabIndex={-1}>
          <Screen />
        </main>
      </div>
      <nav class="bottombar" aria-label="Main areas">
        {areas.filter((a) => a.primary).map((a) => (
          <a key={a.id} href={a.path} class={a.id === area.id ? 'bottom-link active' : 'bottom-link'} aria-current={a.id === area.id ? 'page' : undefined}>
            <a.icon />
            <span>{a.title}</span>
          </a>
        ))}
      </nav>
      {toast && (
        <div class="toast" role="status" aria-live="polite" key={toast.id}>
          <span>{toast.message}</span>
          {toast.action && (
            <button type="button" class="btn btn-small" onClick={() => { toast.action!.run(); setToast(null); }}>
              {toast.action.label}
            </button>
          )}
        </div>
      )}
    </AppContext.Provider>
  );
}

function InstrumentPicker() {
  const { instruments, instrument, selectInstrument } = useApp();
  if (instruments.length === 0) {
    return <a class="picker-empty" href="/instruments/new">Add an instrument</a>;
  }
  return (
    <label class="picker">
      <span class="visually-hidden">Instrument in use</span>
      <select value={instrument?.id ?? ''} onChange={(e) => selectInstrument((e.target as HTMLSelectElement).value)}>
        {instruments.map((p) => (
          <option key={p.id} value={p.id}>{p.name}</option>
        ))}
      </select>
    </label>
  );
}

