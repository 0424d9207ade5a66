import type { Tree } from '../types';
import { CARRIER_INPUTS, gate, leaf, opt, PRESSURE_FROM_READING, USER_MAINTENANCE, STOP_TEXT } from './build';

/** Low sensitivity: prove the loss, separate MS from chromatography, then detector, vacuum, source, calibration, saturation. */
export const sensitivityTree: Tree = {
  id: 'sensitivity',
  title: 'Low sensitivity',
  summary: 'Quantify the loss, rule out the chromatography, then check detector gain, vacuum, the source, resolution and calibration, and saturation.',
  entry: 'LS1',
  nodes: [
    {
      id: 'LS1',
      kind: 'measure',
      title: 'Is the loss real?',
      text: 'Run the same reference test as the baseline (same standard, method and injection) and express the response as a share of the baseline.',
      points: ['For EI, compare the calibrant ion abundances too.'],
      measure: { quantity: 'Reference response as a share of baseline', unit: '%', tool: 'Reference test (area or signal-to-noise)', how: 'Response now ÷ baseline response × 100.' },
      expect: {
        range: { low: 70, high: 1000 },
        tolerance: { kind: 'range', borderline: 0, outer: { low: 50, high: 1000 } },
        source: 'Lab acceptance limit, often at least 50–70 % of baseline (common practice); your lab’s own limit wins.',
      },
      branches: { pass: 'LS1-ok', borderline: 'LS2', low: 'LS2', high: 'LS1-ok' },
    },
    leaf('LS1-ok', 'No confirmed loss', 'The response is within the acceptance limit.', [
      'Record it; review the method’s expectations and the acceptance limit with the lab.',
    ], 'the reference response against the baseline on the next run'),
    {
      id: 'LS2',
      kind: 'question',
      title: 'Does the MS alone show the loss?',
      text: 'Bring calibrant in directly, or infuse, bypassing the chromatography, and compare with its baseline.',
      options: [opt('no', 'No: the MS alone is fine', 'LS2-up'), opt('yes', 'Yes: the MS alone shows the loss', 'LS3')],
    },
    leaf('LS2-up', 'The loss is upstream', 'The chromatography or sample path loses the analyte.', [
      'GC: inlet liner, septum, split ratio, column installation depth, inlet leaks.',
      'LC: flow, mixing, column, matrix suppression, mobile-phase additives, sample preparation.',
      'The autosampler.',
      'Let the inlet and oven cool before changing a liner, septum or column.',
    ], 'the reference response against the baseline', { access: 'covers-on', hazards: ['hot-surface', 'chemical'], cards: ['hot-surface', 'chemical'] }),
    {
      id: 'LS3',
      kind: 'measure',
      title: 'Is the detector gain where it should be?',
      text: 'Read the multiplier voltage the last gain adjustment needed and compare it with its history and the supply maximum.',
      points: ['On a residual gas analyser, gain = multiplier current ÷ Faraday current on a steady peak (m/z 28 or 40).', 'A slow upward trend is normal (common practice).'],
      measure: { visitType: 'multiplier-voltage', quantity: 'Multiplier voltage (as set for the intended gain)', unit: 'V', altUnits: ['kV'], tool: 'Calibration report or read-back', how: 'Take the value the instrument set at its latest gain adjustment.' },
      expect: {
        calc: 'multiplierHeadroom',
        inputs: [{ key: 'supplyMaximum', label: 'Multiplier supply maximum', unit: 'V', default: 3000, min: 100, max: 10000 }],
        tolerance: { kind: 'range', borderline: 0.05 },
      },
      branches: { pass: 'LS4', borderline: 'LS3-em', high: 'LS3-em', low: 'LS4' },
    },
    leaf('LS3-em', 'Multiplier near end of life', 'The gain adjustment needs almost all the supply can give.', [
      'Raise the voltage within its limit as a stop-gap.',
      'Plan a multiplier replacement; record the voltage trend over visits.',
    ], 'the multiplier voltage the gain adjustment needs and the reference response', { hazards: ['high-voltage'], cards: ['high-voltage'] }),
    {
      id: 'LS4',
      kind: 'measure',
      title: 'Is the analyser pressure normal?',
      text: 'Read the high-vacuum gauge and compare with the gas load. High pressure scatters ions, large ones first.',
      measure: { visitType: 'vacuum-high', quantity: 'Analyser pressure, N2-equivalent', unit: 'mbar', altUnits: ['Torr', 'Pa'], tool: 'Instrument ion-gauge read-back', how: 'Usual carrier flow, system settled.' },
      expect: { calc: 'gaugeReadingForCarrier', inputs: CARRIER_INPUTS, tolerance: { kind: 'range', borderline: 0.5, log: true } },
      derived: [{ calc: 'scatteringLoss', inputs: [PRESSURE_FROM_READING] }, { calc: 'meanFreePath', inputs: [PRESSURE_FROM_READING] }],
      branches: { pass: 'LS5', borderline: 'LS5', high: 'LS4-high', low: 'LS4-low' },
      alternatives: [opt('no-carrier', 'No carrier flow here; pressure matches the baseline', 'LS5'), opt('no-carrier-high', 'No carrier flow here; pressure above the baseline', 'LS4-high')],
    },
    leaf('LS4-high', 'Pressure too high', 'Scattering on residual gas costs signal, most at high m/z.', ['Find the gas: leak, water, or a vacuum fault.'], 'the analyser pressure and the reference response', {
      continueWith: ['vacuum', 'leak'],
    }),
    leaf('LS4-low', 'Less gas than the flow should give', 'Carrier is not reaching the MS as set: the column may be broken, plugged or badly installed.', [
      'Check the column at both ends and the chromatograph flow.',
    ], 'the analyser pressure with the carrier flowing'),
    {
      id: 'LS5',
      kind: 'question',
      title: 'Is the ion source free of deposits and correctly set?',
      text: 'EI: hours since the last source service; lens or repeller voltages creeping toward their limits; high-mass abundance falling against low mass (e.g. 502/69 of the perfluorinated amine calibrant); emission and source temperature at set point. Spray sources: deposits on cone, orifice or capillary; sprayer position; gas flows and temperatures; emitter condition.',
      points: ['Ion current is proportional to emission current: a 20 % emission shortfall costs about 20 % of the signal.'],
      options: [opt('dirty', 'Dirty or out of range', 'LS5-G'), opt('ok', 'Clean and at set point', 'LS6')],
    },
    gate('LS5-G', 'covers-off', USER_MAINTENANCE, ['lockout', 'vacuum', 'hot-surface', 'chemical'], 'LS5-clean', 'LS-stop', 'Gate: source cleaning', 'Cleaning needs venting, a cool source, solvents and the power locked out.'),
    leaf('LS5-clean', 'Clean the ion source', 'Clean the source by the maker’s procedure, then pump down, recalibrate and re-measure.', [
      'Let it cool first; vent only through the designated valve.',
      'Handle parts with nitrile gloves; use the solvents with ventilation.',
    ], 'calibrant ion abundances, lens voltages and the reference response', {
      access: 'covers-off',
      hazards: ['venting', 'hot-surface', 'chemical'],
      cards: ['lockout', 'vacuum', 'hot-surface', 'chemical'],
    }),
    {
      id: 'LS6',
      kind: 'question',
      title: 'Are resolution and mass calibration right?',
      text: 'Measure the peak width (FWHM) at three or more ions and the mass errors.',
      points: ['Unit resolution is about 0.5–0.8 u FWHM; mass errors within about ±0.1–0.2 u (common practice).'],
      options: [
        opt('narrow', 'Peaks narrower than they should be', 'LS6-res'),
        opt('offset', 'Masses are off', 'LS6-mass'),
        opt('ok', 'Both right', 'LS7'),
      ],
    },
    leaf('LS6-res', 'Resolution set too high', 'Transmission falls steeply as resolution rises.', ['Reset or recalibrate the resolution.'], 'peak widths at the same ions and the reference response', {
      continueWith: ['peak-shape'],
    }),
    leaf('LS6-mass', 'Mass axis off', 'Selected-ion and transition windows off the peak apex lose signal.', ['Recalibrate the mass axis.'], 'mass errors at three ions and the reference response', {
      continueWith: ['mass-axis'],
    }),
    {
      id: 'LS7',
      kind: 'measure',
      title: 'Is the detector saturating?',
      text: 'Measure the M+1/M ratio of a strong ion and compare with its isotope pattern (e.g. 220/219 of C4F9⁺: 4 carbons).',
      measure: { quantity: 'M+1/M of a strong ion', unit: '%', tool: 'Profile scan', how: 'Heights (or areas) of the M+1 and M peaks.' },
      expect: {
        calc: 'isotopeMPlus1',
        inputs: [
          { key: 'carbons', label: 'Carbon atoms in the ion', unit: '1', default: 4, min: 0, max: 200 },
          { key: 'nitrogens', label: 'Nitrogen atoms in the ion', unit: '1', default: 0, min: 0, max: 50 },
        ],
        tolerance: { kind: 'relative', pass: 0.2, borderline: 0.35 },
      },
      source: 'IUPAC isotopic compositions (13C/12C 0.01082; 15N/14N 0.00365); within about ±20 % relative (common practice).',
      branches: { pass: 'LS8', borderline: 'LS8', high: 'LS7-sat', low: 'LS7-low' },
    },
    leaf('LS7-sat', 'Main peak saturated', 'M+1/M well above theory means the main peak is clipped or losing counts.', [
      'Reduce gain or sample amount; check the detector mode; estimate dead-time loss.',
    ], 'M+1/M of the same ion and a dilution series'),
    leaf('LS7-low', 'M+1 smaller than it should be', 'The wrong ion may be assigned, or the resolution is clipping the M+1 peak.', [
      'Check the ion identity and the peak shape.',
    ], 'M+1/M and the peak profile', { continueWith: ['peak-shape'] }),
    {
      id: 'LS8',
      kind: 'question',
      title: 'Tandem instruments: method settings adequate?',
      text: 'Check collision gas, collision energies, dwell times and points across each peak.',
      points: ['Dwell of about 10–20 ms or more per transition; at least 10–15 points across a chromatographic peak (common practice).'],
      options: [opt('no', 'Something is inadequate', 'LS8-fix'), opt('yes', 'All adequate, or not a tandem instrument', 'LS9')],
    },
    leaf('LS8-fix', 'Method settings', 'Correct the collision gas, energies, dwell and cycle time.', ['Re-run the reference test.'], 'the reference response against the baseline'),
    leaf('LS9', 'Analyser contamination or slow drift', 'The ion guide, pre-filter or rod entrance may be contaminated, or the electronics drift slowly.', [
      'Escalate. Analyser service is for qualified staff only.',
    ], 'the reference response, calibrant ion abundances and multiplier voltage for the hand-over', { escalate: true }),
    leaf('LS-stop', 'Stop and escalate', STOP_TEXT, ['Leave the source closed; pass this walk to someone authorised for source maintenance.'], 'nothing further here; record the as-found readings for whoever takes over', {
      escalate: true,
      cards: ['general'],
    }),
  ],
};
