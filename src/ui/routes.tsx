// Path → screen. Each area owns its paths below its prefix (e.g. /instruments/new, /instruments/<id>).
// Areas other than the overview load on first visit (their code is precached, so this works offline too),
// which keeps the first start on a phone short.
import type { FunctionComponent } from 'preact';
import { useEffect, useState } from 'preact/hooks';
import { HomeScreen } from './screens/HomeScreen';
import { NotFoundScreen } from './screens/NotFoundScreen';
import { lazy } from './lazy';
import { nextTask } from '../records';

type Loader = () => Promise<FunctionComponent>;

function lazyScreen(name: string, load: Loader): FunctionComponent {
  const code = lazy(load); // a failed load is tried again on a later visit
  function LazyScreen() {
    const [state, setState] = useState<{ screen: FunctionComponent | null; failed: boolean }>({ screen: code.now(), failed: false });
    useEffect(() => {
      if (state.screen) return;
      let live = true;
      // Asking for a screen's code adds a link to the page for each module it needs, about a millisecond each: in a
      // task of its own, not in the one that runs every effect of the app's first draw.
      nextTask()
        .then(() => (live ? code.get() : null))
        .then((c) => live && c && setState({ screen: c, failed: false }))
        .catch(() => live && setState({ screen: null, failed: true }));
      return () => {
        live = false;
      };
    }, [state.screen]);
    if (state.screen) {
      const Screen = state.screen;
      return <Screen />;
    }
    if (state.failed) {
      return (
        <section class="screen">
          <h1>{name}</h1>
          <p class="notice" role="alert">This part of Rodside could not be loaded on this device yet. Open Rodside once with a network so it can keep every part for offline use, then try again.</p>
        </section>
      );
    }
    return <p class="muted" aria-live="polite">Loading {name}…</p>;
  }
  return LazyScreen;
}

const table: [prefix: string, screen: FunctionComponent][] = [
  ['/bench', lazyScreen('Bench', () => import('./screens/BenchScreen').then((m) => m.BenchScreen))],
  ['/stability', lazyScreen('Stability', () => import('./screens/StabilityScreen').then((m) => m.StabilityScreen))],
  ['/peak', lazyScreen('Peak', () => import('./screens/PeakScreen').then((m) => m.PeakScreen))],
  ['/scan', lazyScreen('Scan', () => import('./screens/ScanScreen').then((m) => m.ScanScreen))],
  ['/diagnose', lazyScreen('Diagnose', () => import('./screens/DiagnoseScreen').then((m) => m.DiagnoseScreen))],
  ['/visits', lazyScreen('Visits', () => import('./screens/VisitsScreen').then((m) => m.VisitsScreen))],
  ['/instruments', lazyScreen('Instruments', () => import('./screens/InstrumentsScreen').then((m) => m.InstrumentsScreen))],
  ['/safety', lazyScreen('Safety & about', () => import('./screens/SafetyScreen').then((m) => m.SafetyScreen))],
];

export function routeFor(path: string): FunctionComponent {
  if (path === '/') return HomeScreen;
  for (const [prefix, screen] of table) {
    if (path === prefix || path.startsWith(prefix + '/')) return screen;
  }
  return NotFoundScreen;
}
