// The demo scenario: an invented contract-testing lab and its three invented instruments.
// Geometry and supplies are plausible for their classes (common practice), not any real product.
import type { InstrumentProfile, ReadingPhase, Visit } from '../records/types';

export const DEMO_LAB = 'Harrowgate Basin Environmental Testing (invented demo lab)';

const created = '2026-01-05T09:00:00.000Z';

export const demoInstruments: readonly InstrumentProfile[] = [
  {
    id: 'demo-gcms-kestrel',
    name: 'Kestrel — GC-MS single quad (demo)',
    kind: 'gc-ms-single',
    rodFieldRadius: 4.5e-3,
    rodLength: 0.15,
    rfFrequency: 1.0e6,
    maxRfAmplitude: 1600,
    axialEnergy: 5,
    multiplierVoltageLimit: 2600,
    readbackConvention: { amplitude: 'zero-to-peak', reference: 'per-rod' },
    notes: 'Volatiles bench, basement room B-04. Helium carrier about 1 mL/min. Invented demo instrument.',
    demo: true,
    createdAt: created,
    updatedAt: created,
  },
  {
    id: 'demo-lcms-heron',
    name: 'Heron — LC-MS triple quad, Q1/Q3 (demo)',
    kind: 'lc-ms-triple',
    rodFieldRadius: 4.0e-3,
    rodLength: 0.2,
    rfFrequency: 1.2e6,
    maxRfAmplitude: 4200,
    axialEnergy: 2,
    readbackConvention: { amplitude: 'peak-to-peak', reference: 'per-rod' },
    notes: 'Pesticides suite. Read-backs are peak-to-peak on one rod. Invented demo instrument.',
    demo: true,
    createdAt: created,
    updatedAt: created,
  },
  {
    id: 'demo-rga-wren',
    name: 'Wren — residual gas analyser on coater 2 (demo)',
    kind: 'rga',
    rodFieldRadius: 3.0e-3,
    rodLength: 0.1,
    rfFrequency: 2.5e6,
    maxRfAmplitude: 900,
    axialEnergy: 8,
    readbackConvention: { amplitude: 'zero-to-peak', reference: 'per-rod' },
    notes: 'Range 1–100 u, Faraday cup and electron multiplier. Invented demo instrument.',
    demo: true,
    createdAt: created,
    updatedAt: created,
  },
];

// ---- Invented visits, about two years of them --------------------------------------------------
// Kestrel's multiplier voltage creeps up visit after visit (ageing), one visit finds an air leak at a
// transfer-line nut, and the rough-pump oil is changed once. Every name and number here is made up.

const demoEngineer = 'T. Placeholder (invented demo engineer)';
const demoSite = 'Harrowgate Basin Environmental Testing, basement B-04 (invented)';

function visit(id: string, instrumentId: string, startedAt: string, reason: Visit['reason'], notes: string, partsUsed: string, extra: Partial<Visit> = {}): Visit {
  return {
    id: `demo-visit-${id}`, instrumentId, startedAt, site: demoSite, engineer: demoEngineer, reason,
    notes: `${notes} (Invented demo visit.)`, partsUsed, demo: true, createdAt: startedAt, updatedAt: startedAt, ...extra,
  };
}

export const demoVisits: readonly Visit[] = [
  visit('k1', 'demo-gcms-kestrel', '2024-12-10T09:00:00.000Z', 'installation', 'Installation and first calibration. As-left values set as the baseline.', 'None', { baseline: true, testEquipment: 'Demo DMM DM-01, calibration due 2025-11 (invented)' }),
  visit('k2', 'demo-gcms-kestrel', '2025-03-18T09:30:00.000Z', 'preventive', 'Six-month check. Source clean, rough-pump oil looks fine.', 'Source insulator kit'),
  visit('k3', 'demo-gcms-kestrel', '2025-06-24T10:00:00.000Z', 'preventive', 'Routine. Multiplier needs a little more voltage at each gain adjustment.', 'None'),
  visit('k4', 'demo-gcms-kestrel', '2025-09-30T08:45:00.000Z', 'after-venting-or-cleaning', 'Vented for a column change; pumped down overnight, water falling.', 'Column nut and ferrule'),
  visit('k5', 'demo-gcms-kestrel', '2026-01-13T09:15:00.000Z', 'preventive', 'Rough-pump oil changed; fore-vacuum back to normal.', 'Rough-pump oil, 1 L'),
  visit('k6', 'demo-gcms-kestrel', '2026-04-21T13:00:00.000Z', 'sensitivity-loss', 'Area counts down by a third. Air check showed m/z 28 high with 28:32 near 3.8: loose transfer-line nut, tightened. Area counts back to normal after a bake-out overnight.', 'Transfer-line ferrule'),
  visit('k7', 'demo-gcms-kestrel', '2026-07-28T09:00:00.000Z', 'preventive', 'Routine. Multiplier voltage keeps rising about 15 V a month; plan a replacement.', 'None'),
  visit('k8', 'demo-gcms-kestrel', '2026-10-27T09:00:00.000Z', 'preventive', 'Routine. Quote sent for a new multiplier.', 'Filament'),
  visit('h1', 'demo-lcms-heron', '2025-05-06T09:00:00.000Z', 'installation', 'Installation. Baseline set. Read-backs are peak-to-peak.', 'None', { baseline: true }),
  visit('h2', 'demo-lcms-heron', '2025-11-18T09:00:00.000Z', 'preventive', 'Routine; cone cleaned.', 'Cone O-ring'),
  visit('h3', 'demo-lcms-heron', '2026-05-19T09:00:00.000Z', 'preventive', 'Routine.', 'None'),
  visit('w1', 'demo-rga-wren', '2025-02-04T10:00:00.000Z', 'installation', 'RGA fitted to coater 2. Baseline set after bake-out.', 'Gasket', { baseline: true }),
  visit('w2', 'demo-rga-wren', '2025-10-07T10:00:00.000Z', 'failure', 'Process chamber base pressure high: 28:32 near 3.9 and argon at m/z 40, an air leak at a viewport. Resealed.', 'Viewport gasket'),
  visit('w3', 'demo-rga-wren', '2026-06-09T10:00:00.000Z', 'preventive', 'Routine.', 'None'),
];

export interface DemoReadingSeed {
  visitId: string;
  typeId: string;
  phase: ReadingPhase;
  /** As typed, in unitId. */
  text: string;
  unitId: string;
  context?: Record<string, string>;
  note?: string;
  takenAt?: string;
}

const seeds: DemoReadingSeed[] = [];
function add(v: string, typeId: string, phase: ReadingPhase, text: string, unitId: string, context?: Record<string, string>, note?: string): void {
  seeds.push({ visitId: `demo-visit-${v}`, typeId, phase, text, unitId, ...(context ? { context } : {}), ...(note ? { note } : {}) });
}

// Kestrel: as-found and as-left per visit. [multiplier V, high vacuum Torr, fore-vacuum mbar]
const kestrel: [string, number, number, string, string, string, string][] = [
  // visit, multiplier found, multiplier left, high vac found, high vac left, fore found, fore left
  ['k1', 1400, 1420, '1.2e-5', '1.1e-5', '3.0e-2', '3.0e-2'],
  ['k2', 1465, 1460, '1.2e-5', '1.15e-5', '3.4e-2', '3.3e-2'],
  ['k3', 1520, 1505, '1.25e-5', '1.2e-5', '4.1e-2', '4.0e-2'],
  ['k4', 1560, 1545, '2.9e-5', '1.3e-5', '4.6e-2', '4.4e-2'],
  ['k5', 1610, 1600, '1.3e-5', '1.2e-5', '6.8e-2', '3.1e-2'],
  ['k6', 1690, 1650, '3.8e-5', '1.25e-5', '3.5e-2', '3.4e-2'],
  ['k7', 1720, 1705, '1.3e-5', '1.2e-5', '3.9e-2', '3.8e-2'],
  ['k8', 1770, 1750, '1.3e-5', '1.25e-5', '4.2e-2', '4.1e-2'],
];
for (const [v, mvFound, mvLeft, hvFound, hvLeft, fvFound, fvLeft] of kestrel) {
  add(v, 'multiplier-voltage', 'as-found', String(mvFound), 'V');
  add(v, 'multiplier-voltage', 'as-left', String(mvLeft), 'V');
  add(v, 'vacuum-high', 'as-found', hvFound, 'Torr', { gaugeGas: 'N2-equivalent' });
  add(v, 'vacuum-high', 'as-left', hvLeft, 'Torr', { gaugeGas: 'N2-equivalent' });
  add(v, 'vacuum-fore', 'as-found', fvFound, 'mbar', { gaugeGas: 'N2-equivalent' });
  add(v, 'vacuum-fore', 'as-left', fvLeft, 'mbar', { gaugeGas: 'N2-equivalent' });
  add(v, 'emission-current', 'as-left', v === 'k8' ? '34.9' : '34.5', 'uA', { setpoint: '35' });
  add(v, 'source-temperature', 'as-left', '230.4', 'degC', { setpoint: '230' });
}
// RF at two parked masses on the installation and last visit (one rod to ground, zero-to-peak).
add('k1', 'rf-amplitude', 'as-left', '100.4', 'V0p-rod', { mz: '69' });
add('k1', 'rf-amplitude', 'as-left', '731.0', 'V0p-rod', { mz: '502' });
add('k8', 'rf-amplitude', 'as-found', '100.6', 'V0p-rod', { mz: '69' });
add('k8', 'rf-amplitude', 'as-found', '738.9', 'V0p-rod', { mz: '502' }, 'Slightly high at 502: linearity worth a look next visit.');
add('k1', 'rf-frequency', 'as-left', '1.00012', 'MHz');
add('k8', 'rf-frequency', 'as-found', '1.00013', 'MHz');
for (const [v, w69, w219, w502] of [['k1', '0.60', '0.61', '0.62'], ['k5', '0.61', '0.62', '0.64'], ['k8', '0.62', '0.63', '0.69']]) {
  add(v, 'peak-width', 'as-left', w69, 'u', { mz: '69' });
  add(v, 'peak-width', 'as-left', w219, 'u', { mz: '219' });
  add(v, 'peak-width', 'as-left', w502, 'u', { mz: '502' });
  // Calibrant ions chosen by the (invented) engineer for Kestrel: 219 and 502 as % of 69, and M+1/M at 219.
  add(v, 'calibrant-ratio', 'as-left', v === 'k8' ? '41' : '48', 'percent', { mz: '219', referenceMz: '69' });
  add(v, 'calibrant-ratio', 'as-left', v === 'k8' ? '3.1' : '3.6', 'percent', { mz: '502', referenceMz: '69' });
  add(v, 'calibrant-isotope', 'as-left', v === 'k8' ? '4.5' : '4.3', 'percent', { mz: '219', formula: 'C4F9' });
}
// Background gas on Kestrel: water against its own baseline, air by the 28:32 ratio (with 40:28 from the same scan).
add('k1', 'water-18', 'as-left', '8', 'percent', { referenceMz: '69' });
add('k4', 'water-18', 'as-found', '35', 'percent', { referenceMz: '69' }, 'Water still falling after the vent.');
add('k4', 'water-18', 'as-left', '14', 'percent', { referenceMz: '69' }, 'Next morning: falling as expected.');
add('k1', 'air-ratio-28-32', 'as-left', '7.5', 'ratio', undefined, 'Mostly CO and N2 from the carrier line, little oxygen: not air.');
add('k6', 'air-ratio-28-32', 'as-found', '3.8', 'ratio', { argonPercent: '1.6' }, 'Air-like ratio and argon agrees.');
add('k6', 'air-ratio-28-32', 'as-left', '7.1', 'ratio');
// Heron: read-backs are peak-to-peak, one rod to ground.
for (const [v, mv, rf] of [['h1', '1750', '2018'], ['h2', '1820', '2021'], ['h3', '1905', '2015']] as const) {
  add(v, 'multiplier-voltage', 'as-left', mv, 'V');
  add(v, 'rf-amplitude', 'as-left', rf, 'Vpp-rod', { mz: '609' });
  add(v, 'vacuum-fore', 'as-left', v === 'h3' ? '2.4' : '2.1', 'mbar', { gaugeGas: 'N2-equivalent' });
}
// Wren: RGA on a coater.
for (const [v, hv, ratio, em] of [['w1', '2.0e-7', '1.2', '1.00'], ['w2', '6.5e-6', '3.9', '0.97'], ['w3', '2.2e-7', '1.3', '0.99']] as const) {
  add(v, 'vacuum-high', v === 'w2' ? 'as-found' : 'as-left', hv, 'mbar', { gaugeGas: 'N2-equivalent' });
  add(v, 'air-ratio-28-32', v === 'w2' ? 'as-found' : 'as-left', ratio, 'ratio', v === 'w2' ? { argonPercent: '1.8' } : undefined);
  add(v, 'emission-current', 'as-left', em, 'mA', { setpoint: '1' });
}
add('w2', 'vacuum-high', 'as-left', '2.3e-7', 'mbar', { gaugeGas: 'N2-equivalent' });
add('w2', 'air-ratio-28-32', 'as-left', '1.3', 'ratio');

export const demoReadings: readonly DemoReadingSeed[] = seeds;
