import type { Tree } from '../types';
import { BEHIND_COVERS, gate, leaf, LIVE_WORK, opt, STOP_TEXT } from './build';

const VERIFY = 'the reference ions’ m/z errors, then an independent check compound (before and after); positive and negative modes separately';

/** Mass-axis shift: measure the error at several ions, fit Δ(m) = a + b·m, then offset, scale or irregular. */
export const massAxisTree: Tree = {
  id: 'mass-axis',
  title: 'Mass-axis shift',
  summary: 'Measure the error at three or more reference ions, fit offset and slope, and trace a scale error to frequency, temperature or RF calibration.',
  entry: 'MA1',
  nodes: [
    {
      id: 'MA1',
      kind: 'measure',
      title: 'How far off is the axis?',
      text: 'Take the observed centroid of three or more reference ions across the range and subtract the reference masses. Enter the largest error (its size).',
      points: [
        'Perfluorinated calibrant ions have a negative mass defect: CF3⁺ 68.995, C4F9⁺ 218.985, C9F20N⁺ 501.971 (AME 2020; computed).',
        'Expect some drift after venting until temperatures settle (common practice).',
      ],
      measure: { quantity: 'Largest |observed − reference| m/z', unit: 'u', tool: 'Calibrant scan', toolLink: { path: '/scan/mass-axis', label: 'Mass-axis check' }, how: 'Centroid each reference ion; compare with its exact mass.' },
      expect: { range: { low: 0, high: 0.1 }, tolerance: { kind: 'range', borderline: 1 }, source: 'Mass errors within about ±0.1–0.2 u (common practice); your method’s limit wins.' },
      branches: { pass: 'MA-ok', borderline: 'MA2', high: 'MA2', low: 'MA2' },
    },
    leaf('MA-ok', 'Within specification', 'The axis is within tolerance.', ['Record the errors.'], VERIFY),
    {
      id: 'MA2',
      kind: 'choice',
      title: 'What pattern does the error follow?',
      text: 'Fit Δ(m) = a + b·m to the errors. Constant offset: b ≈ 0. Proportional: a ≈ 0. Neither: irregular.',
      options: [opt('offset', 'Constant offset', 'MA3'), opt('scale', 'Proportional to m/z', 'MA4-G'), opt('irregular', 'Irregular or non-linear', 'MA5')],
    },
    leaf('MA3', 'Offset', 'The calibration intercept has changed, the ion energy or rod offset changed with new settings, or a resolution change moved the centroid of asymmetric peaks.', [
      'Fix the peak shape first if the peaks are asymmetric.',
      'Recalibrate. If the offset returns, check the stability of the DC offset.',
    ], VERIFY, { continueWith: ['peak-shape'] }),
    gate('MA4-G', 'energised', LIVE_WORK, ['rf', 'high-voltage'], 'MA4', 'MA-stop', 'Gate: RF frequency on a running instrument', 'The next step reads the RF frequency with a loosely coupled pickup near the RF circuit while the instrument runs.'),
    {
      id: 'MA4',
      kind: 'measure',
      title: 'Has the RF frequency moved?',
      text: 'Measure the RF frequency with a counter or oscilloscope through a loosely coupled pickup loop (no contact: a probe’s capacitance would shift the frequency itself).',
      points: ['Apparent mass scales as 2·δf/f: +0.01 % in frequency gives +0.1 u at m/z 500 (Dawson 1976; derived).'],
      access: 'energised',
      hazards: ['rf', 'high-voltage'],
      cards: ['rf', 'high-voltage'],
      measure: { visitType: 'rf-frequency', quantity: 'RF frequency', unit: 'MHz', altUnits: ['kHz', 'Hz'], tool: 'Frequency counter or oscilloscope with a pickup loop', how: 'Hold the loop near the RF circuit, not touching; read to at least 6 digits.' },
      expect: { calc: 'rfFrequencyNominal', tolerance: { kind: 'relative', pass: 2e-5, borderline: 1e-4 } },
      derived: [
        {
          calc: 'apparentMassShift',
          inputs: [
            { key: 'mz', label: 'm/z to express the shift at', unit: 'u', default: 500, min: 1, max: 10000 },
            { key: 'frequency', label: 'Frequency measured', unit: 'MHz', min: 0.001, max: 100, fromReading: true },
          ],
        },
      ],
      source: 'δm/m = 2·δf/f (Dawson 1976). Pass ±2×10⁻⁵ (±0.02 u at m/z 500) is our working tolerance; compare with the instrument’s own baseline where known.',
      branches: { pass: 'MA4-q', borderline: 'MA4-freq-G', low: 'MA4-freq-G', high: 'MA4-freq-G' },
      alternatives: [opt('cannot', 'No safe way to measure the frequency here', 'MA4-q')],
    },
    gate('MA4-freq-G', 'covers-off', BEHIND_COVERS, ['rf', 'stored-charge', 'lockout'], 'MA4-freq', 'MA-stop', 'Gate: RF oscillator and tank with the power off', 'The next step works on the RF cabling, oscillator or tank circuit: power locked out, RF tank capacitors discharged.'),
    leaf('MA4-freq', 'RF frequency has moved', 'The RF oscillator or tank circuit has changed, or extra capacitance is loading it (a probe left on, a moved cable, contamination).', [
      'With the power locked out: remove any probe; restore cable routing; repair the RF oscillator or tank by the procedure.',
    ], 'the RF frequency and ' + VERIFY, { access: 'covers-off', hazards: ['rf', 'stored-charge'], cards: ['rf', 'stored-charge', 'lockout'], escalate: true }),
    {
      id: 'MA4-q',
      kind: 'question',
      title: 'Does the shift follow temperature or warm-up?',
      text: 'Log instrument and room temperature against time beside the mass error.',
      points: ['Thermal expansion of the rod spacers alone gives about +0.08–0.17 u at m/z 1000 for 5 K (CRC expansion coefficients, recalled); RF detector drift is often larger (common practice).'],
      options: [opt('thermal', 'Yes, it follows temperature or time since power-on', 'MA4-temp'), opt('no', 'No', 'MA4-amp')],
    },
    leaf('MA4-temp', 'Thermal drift', 'Let the instrument reach thermal equilibrium (often several hours after power-on or pump-down) before calibrating.', [
      'Stabilise the room, about ±1–2 °C (common practice); the site specification rules.',
      'Recalibrate at equilibrium.',
    ], VERIFY),
    leaf('MA4-amp', 'RF amplitude calibration drift', 'The RF detector or amplitude calibration drifts.', ['Recalibrate; if the drift persists, suspect the RF module.'], VERIFY, { escalate: true }),
    leaf('MA5', 'Irregular shift', 'Check that the calibrant is the right one and fresh, and that each reference ion was assigned to the right peak.', [
      'Recalibrate.',
      'If the error grows only at the top of the range, the RF amplifier may be near its limit: check its tuning and drive (no-signal tree, the step *Is RF on the rods, at the right amplitude?*).',
    ], VERIFY, { continueWith: ['no-signal'] }),
    leaf('MA-stop', 'Stop and escalate the frequency check', STOP_TEXT, [
      'Go back one step and answer the temperature question instead, or pass this walk to someone authorised for live RF work.',
    ], 'nothing further here; record the mass errors for whoever takes over', { escalate: true, cards: ['general'] }),
  ],
};
