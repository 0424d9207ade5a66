// Path → screen. Each area owns its paths below its prefix (e.g. /instruments/new, /instruments/<id>).
import type { FunctionComponent } from 'preact';
import { BenchScreen } from './screens/BenchScreen';
import { DiagnoseScreen } from './screens/DiagnoseScreen';
import { HomeScreen } from './screens/HomeScreen';
import { InstrumentsScreen } from './screens/InstrumentsScreen';
import { NotFoundScreen } from './screens/NotFoundScreen';
import { PeakScreen } from './screens/PeakScreen';
import { SafetyScreen } from './screens/SafetyScreen';
import { StabilityScreen } from './screens/StabilityScreen';
import { VisitsScreen } from './screens/VisitsScreen';

const table: [prefix: string, screen: FunctionComponent][] = [
  ['/bench', BenchScreen],
  ['/stability', StabilityScreen],
  ['/peak', PeakScreen],
  ['/diagnose', DiagnoseScreen],
  ['/visits', VisitsScreen],
  ['/instruments', InstrumentsScreen],
  ['/safety', SafetyScreen],
];

export function routeFor(path: string): FunctionComponent {
  if (path === '/') return HomeScreen;
  for (const [prefix, screen] of table) {
    if (path === prefix || path.startsWith(prefix + '/')) return screen;
  }
  return NotFoundScreen;
}
