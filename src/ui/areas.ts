// The app's areas: each has its own path (deep links work) and a place in the navigation.
import type { FunctionComponent } from 'preact';
import { IconBolt, IconCaution, IconHome, IconInstrument, IconLog, IconPeak, IconRegion, IconSpectrum, IconWalk } from './components/icons';

export interface Area {
  id: string;
  path: string;
  title: string;
  /** One line saying what the area answers. */
  blurb: string;
  icon: FunctionComponent;
  /** Shown in the phone's bottom bar. */
  primary: boolean;
}

export const areas: readonly Area[] = [
  { id: 'home', path: '/', title: 'Overview', blurb: 'Current instrument, storage state and every area.', icon: IconHome, primary: true },
  { id: 'bench', path: '/bench', title: 'Bench', blurb: 'Expected RF and DC for an m/z on this analyser, read-back checks and the vacuum check.', icon: IconBolt, primary: true },
  { id: 'stability', path: '/stability', title: 'Stability', blurb: 'Operating points on the stability diagram, pass band and resolution planning.', icon: IconRegion, primary: true },
  { id: 'peak', path: '/peak', title: 'Peak', blurb: 'Simulated peak shape and transmission for these settings.', icon: IconPeak, primary: false },
  { id: 'scan', path: '/scan', title: 'Scan', blurb: 'A measured scan: its peaks, isotope ratios and whether the operating point explains a peak’s shape; exact masses; the mass-axis check.', icon: IconSpectrum, primary: false },
  { id: 'diagnose', path: '/diagnose', title: 'Diagnose', blurb: 'Step-by-step fault finding, no signal first, with safety gates.', icon: IconWalk, primary: true },
  { id: 'visits', path: '/visits', title: 'Visits', blurb: 'Readings from each service visit, judged and kept on this device.', icon: IconLog, primary: true },
  { id: 'instruments', path: '/instruments', title: 'Instruments', blurb: 'Analyser geometry, RF supply and read-back convention per instrument.', icon: IconInstrument, primary: false },
  { id: 'safety', path: '/safety', title: 'Safety & about', blurb: 'Hazard cards, sources, storage and version.', icon: IconCaution, primary: false },
];

export function areaForPath(path: string): Area {
  if (path === '/') return areas[0];
  return areas.find((a) => a.path !== '/' && (path === a.path || path.startsWith(a.path + '/'))) ?? areas[0];
}
