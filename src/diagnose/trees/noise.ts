import type { Tree } from '../types';
import { leaf, opt } from './build';

/** Noisy or unstable signal: compare with counting statistics, split detector from beam, find periodic sources. */
export const noiseTree: Tree = {
  id: 'noise',
  title: 'Noisy or unstable signal',
  summary: 'Compare the noise with the counting-statistics limit, tell detector noise from beam noise, and trace periodic noise to its source.',
  entry: 'NU1',
  nodes: [
    {
      id: 'NU1',
      kind: 'measure',
      title: 'Is the noise near the counting limit?',
      text: 'Measure the RSD of a steady ion (calibrant or infusion) over about 1–2 min, and the baseline in a blank region.',
      measure: { quantity: 'RSD of a steady ion', unit: '%', tool: 'Acquisition of repeated scans', how: 'Standard deviation ÷ mean of the ion’s intensity over the scans.' },
      expect: {
        calc: 'poissonRsd',
        inputs: [{ key: 'counts', label: 'Ion counts per reading (pulse counting)', unit: 'counts', min: 1, max: 1e15 }],
        tolerance: { kind: 'relative', pass: 0.5, borderline: 1 },
      },
      source: 'RSD = 1/√N (Knoll 2010). Up to 1.5 × that limit passes; up to 2 × is borderline (our working tolerance).',
      branches: { pass: 'NU1-stat', borderline: 'NU2', high: 'NU2', low: 'NU1-low' },
      alternatives: [opt('analog', 'Analog detection: no count number; the noise is clearly above the baseline noise', 'NU2')],
    },
    leaf('NU1-stat', 'Counting statistics', 'The noise is what the number of ions allows: not a fault.', ['Raise the signal or the dwell time.'], 'the RSD at the new signal or dwell'),
    leaf('NU1-low', 'RSD below the counting limit', 'That cannot come from ion counts: the number entered is not the ion count (analog detection, summed scans).', [
      'Judge the noise against this instrument’s baseline instead.',
    ], 'the RSD against the baseline RSD'),
    {
      id: 'NU2',
      kind: 'question',
      title: 'Is the excess noise there with no ions?',
      text: 'Stop ion production (filament off, spray off, calibrant closed) and look again.',
      options: [opt('yes', 'Yes: detector or electronics', 'NU3'), opt('no', 'No: it comes with the ion beam', 'NU5')],
    },
    {
      id: 'NU3',
      kind: 'question',
      title: 'Do spikes grow with the multiplier voltage, or is the pressure high?',
      text: 'Raise the multiplier voltage by about 100 V (common practice) and watch the spikes; check the analyser pressure.',
      points: ['Multipliers at about 10⁻⁵ mbar or above are at risk (common practice).'],
      hazards: ['high-voltage'],
      cards: ['high-voltage'],
      options: [opt('yes', 'Yes', 'NU3-em'), opt('no', 'No', 'NU4')],
    },
    leaf('NU3-em', 'Multiplier discharge or ageing', 'Multiplier discharge, ageing or breakdown on an HV feedthrough.', [
      'Check the pressure; check HV feedthroughs for contamination or humidity.',
      'Replace the multiplier if it persists.',
    ], 'the dark noise at the working multiplier voltage', { hazards: ['high-voltage', 'venting'], cards: ['high-voltage', 'vacuum', 'lockout'] }),
    {
      id: 'NU4',
      kind: 'choice',
      title: 'Is the noise periodic?',
      text: 'Take an FFT of a fast baseline trace, or watch a safe monitor output on an oscilloscope.',
      points: [
        'Mains 50/60 Hz and 100/120 Hz; rough pump rpm/60 (about 24–29 Hz, from memory); turbo rpm/60 (about 400–1500 Hz, from memory).',
      ],
      options: [
        opt('mains', '50/60 or 100/120 Hz', 'NU4-mains'),
        opt('pump', 'At a pump frequency', 'NU4-pump'),
        opt('khz', 'In the kHz range', 'NU4-smps'),
        opt('random', 'Random or intermittent', 'NU4-conn'),
      ],
    },
    leaf('NU4-mains', 'Mains pickup, ripple or ground loop', 'Check protective-earth and signal-ground continuity, cable routing and shared outlets.', [
      'Bond measurements only with the equipment locked out.',
    ], 'the noise spectrum', { hazards: ['high-voltage'], cards: ['high-voltage', 'lockout'] }),
    leaf('NU4-pump', 'Vibration', 'Microphonics from a pump: check mounts, bellows and the bench.', ['Do not move a running turbo.'], 'the noise spectrum', { hazards: ['rotating'], cards: ['turbo'] }),
    leaf('NU4-smps', 'Failing switched-mode supply', 'A supply’s switching ripple gets into the signal.', ['Find the supply by elimination and replace it by the procedure.'], 'the noise spectrum', {
      hazards: ['high-voltage'],
      cards: ['high-voltage', 'lockout'],
    }),
    leaf('NU4-conn', 'Connectors or cables', 'Intermittent contacts.', [
      'Wiggle-test only de-energised or as the procedure allows.',
      'If clean, see where on the peak the noise is largest (beam noise steps).',
    ], 'the noise over the same period', { hazards: ['high-voltage'], cards: ['high-voltage', 'lockout'] }),
    {
      id: 'NU5',
      kind: 'question',
      title: 'Where on the peak is the noise largest?',
      text: 'Compare the noise on the flanks of a peak with the noise at its apex.',
      options: [opt('flanks', 'On the flanks, least at the apex (mass jitter)', 'NU5-rf'), opt('apex', 'In proportion at the apex (ion-current fluctuation)', 'NU6')],
    },
    leaf('NU5-rf', 'RF/DC or frequency instability', 'The mass axis jitters.', ['Check RF stability, thermal drift and mains quality; escalate the RF module.'], 'the flank and apex noise', {
      escalate: true,
      continueWith: ['mass-axis'],
    }),
    {
      id: 'NU6',
      kind: 'choice',
      title: 'Which source?',
      text: 'The beam itself fluctuates: look at the source.',
      options: [
        { ...opt('ei', 'Electron ionisation', 'NU6-ei'), fits: ['gc-ms-single', 'gc-ms-triple'] },
        { ...opt('esi', 'Electrospray', 'NU6-esi'), fits: ['lc-ms-single', 'lc-ms-triple'] },
        { ...opt('apci', 'APCI', 'NU6-apci'), fits: ['lc-ms-single', 'lc-ms-triple'] },
        { ...opt('rga', 'Residual gas analyser', 'NU6-rga'), fits: ['rga'] },
      ],
    },
    leaf('NU6-ei', 'EI source', 'Filament near end of life, emission regulation, carrier pressure or flow oscillating, source temperature cycling, or charging of contaminated insulators or lenses.', [
      'Clean the source if insulators or lenses are contaminated.',
    ], 'the RSD of the same ion', { hazards: ['hot-surface'], cards: ['hot-surface'] }),
    leaf('NU6-esi', 'Electrospray', 'LC pump pulsation (noise period equal to the pump stroke), bubbles, emitter damage or position, flow too low for the voltage, gas flow, or discharge in negative mode.', [
      'Degas the eluent; lower the voltage if it discharges.',
    ], 'the RSD of the same ion', { hazards: ['high-voltage', 'chemical'], cards: ['high-voltage', 'chemical'] }),
    leaf('NU6-apci', 'APCI', 'The corona needle is worn or contaminated.', ['Clean or replace it by the procedure.'], 'the corona current and the RSD', { hazards: ['high-voltage'], cards: ['high-voltage', 'lockout'] }),
    leaf('NU6-rga', 'Residual gas analyser', 'Compare with an independent total-pressure gauge: the process pressure may really be fluctuating.', [
      'If it is the analyser, log the noise metrics and the spectrum and escalate.',
    ], 'the partial pressure and the total pressure together'),
  ],
};
