// The demo scenario: an invented contract-testing lab and its three invented instruments.
// Geometry and supplies are plausible for their classes (common practice), not any real product.
import type { InstrumentProfile } from './types';

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
