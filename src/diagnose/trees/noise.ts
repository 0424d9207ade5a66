import type { Tree } from '../types';
import { BEHIND_COVERS, gate, leaf, LIVE_WORK, opt, STOP_TEXT, USER_MAINTENANCE } from './build';
import type { Option } from '../types';

/** The periodic-noise answers, the same whether the trace comes from an FFT or an oscilloscope. */
const PERIODIC: Option[] = [
  opt('mains', '50/60 or 100/120 Hz', 'NU4-mains-G'),
  opt('pump', 'At a pump frequency', 'NU4-pump'),
  opt('khz', 'In the kHz range', 'NU4-smps-G'),
  opt('random', 'Random or intermittent', 'NU4-conn-G'),
];
const PERIODIC_POINTS = ['Mains 50/60 Hz and 100/120 Hz; rough pump rpm/60 (about 24–29 Hz, from memory); turbo rpm/60 (about 400–1500 Hz, from memory).'];

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
      options: [opt('yes', 'Yes', 'NU3-em-G'), opt('no', 'No', 'NU4')],
    },
    gate('NU3-em-G', 'covers-off', BEHIND_COVERS, ['high-voltage', 'stored-charge', 'vacuum', 'lockout'], 'NU3-em', 'NU-stop', 'Gate: multiplier and HV feedthroughs', 'The next step works at the HV feedthroughs and may replace the multiplier: power locked out, discharge time passed, vented.'),
    leaf('NU3-em', 'Multiplier discharge or ageing', 'Multiplier discharge, ageing or breakdown on an HV feedthrough.', ['Check the pressure; with the power locked out and discharged, check HV feedthroughs for contamination or humidity. Replace the multiplier if it persists.'], 'the dark noise at the working multiplier voltage', { access: 'covers-off', hazards: ['high-voltage', 'stored-charge', 'venting'], cards: ['high-voltage', 'stored-charge', 'vacuum', 'lockout'] }),
    {
      id: 'NU4',
      kind: 'choice',
      title: 'Is the noise periodic?',
      text: 'Take an FFT of a fast baseline trace from the acquired data.',
      points: PERIODIC_POINTS,
      options: [...PERIODIC, opt('no-trace', 'No fast trace to analyse: watch a monitor output on an oscilloscope', 'NU4-G')],
    },
    gate('NU4-G', 'energised', LIVE_WORK, ['high-voltage'], 'NU4s', 'NU-stop', 'Gate: oscilloscope on a running instrument', 'The next step connects an oscilloscope to a monitor output while the instrument runs: live work, with a probe and oscilloscope rated for the voltage present and the protective earth kept.'),
    {
      id: 'NU4s',
      kind: 'choice',
      title: 'Is the noise periodic on the oscilloscope?',
      text: 'Watch the designated monitor output on an oscilloscope. Connect the probe with the instrument off where the procedure allows; never lift the oscilloscope’s protective earth.',
      points: PERIODIC_POINTS,
      access: 'energised',
      hazards: ['high-voltage'],
      cards: ['high-voltage'],
      options: PERIODIC,
    },
    gate('NU4-mains-G', 'covers-off', BEHIND_COVERS, ['high-voltage', 'stored-charge', 'lockout'], 'NU4-mains', 'NU-stop', 'Gate: earth and ground bonds', 'The next step checks earth and ground bonds and cable routing: equipment locked out, discharge time passed.'),
    leaf('NU4-mains', 'Mains pickup, ripple or ground loop', 'Check protective-earth and signal-ground continuity, cable routing and shared outlets.', [
      'Bond measurements only with the equipment locked out.',
    ], 'the noise spectrum', { access: 'covers-off', hazards: ['high-voltage', 'stored-charge'], cards: ['high-voltage', 'stored-charge', 'lockout'] }),
    leaf('NU4-pump', 'Vibration', 'Microphonics from a pump: check mounts, bellows and the bench.', ['Do not move a running turbo.'], 'the noise spectrum', { access: 'covers-on', hazards: ['rotating'], cards: ['turbo'] }),
    gate('NU4-smps-G', 'covers-off', BEHIND_COVERS, ['high-voltage', 'stored-charge', 'lockout'], 'NU4-smps', 'NU-stop', 'Gate: supply replacement', 'The next step replaces a switched-mode supply: equipment locked out, discharge time passed, absence of voltage proved.'),
    leaf('NU4-smps', 'Failing switched-mode supply', 'A supply’s switching ripple gets into the signal.', ['Find the supply by elimination and replace it by the procedure.'], 'the noise spectrum', { access: 'covers-off', hazards: ['high-voltage', 'stored-charge'], cards: ['high-voltage', 'stored-charge', 'lockout'] }),
    gate('NU4-conn-G', 'covers-off', BEHIND_COVERS, ['high-voltage', 'stored-charge', 'lockout'], 'NU4-conn', 'NU-stop', 'Gate: connectors and cables', 'The next step wiggle-tests connectors and cables: equipment locked out, discharge time passed.'),
    leaf('NU4-conn', 'Connectors or cables', 'Intermittent contacts.', [
      'Wiggle-test only de-energised, or live only as the procedure allows and your live-work authorisation covers.',
      'If clean, see where on the peak the noise is largest (beam noise steps).',
    ], 'the noise over the same period', { access: 'covers-off', hazards: ['high-voltage', 'stored-charge'], cards: ['high-voltage', 'stored-charge', 'lockout'] }),
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
        { ...opt('ei', 'Electron ionisation', 'NU6-ei-G'), fits: ['gc-ms-single', 'gc-ms-triple'] },
        { ...opt('esi', 'Electrospray', 'NU6-esi'), fits: ['lc-ms-single', 'lc-ms-triple'] },
        { ...opt('apci', 'APCI', 'NU6-apci-G'), fits: ['lc-ms-single', 'lc-ms-triple'] },
        { ...opt('rga', 'Residual gas analyser', 'NU6-rga'), fits: ['rga'] },
      ],
    },
    gate('NU6-ei-G', 'covers-off', USER_MAINTENANCE, ['lockout', 'vacuum', 'hot-surface', 'chemical'], 'NU6-ei', 'NU-stop', 'Gate: EI source service', 'The next step may open and clean the EI source: power locked out, source cool, vented.'),
    leaf('NU6-ei', 'EI source', 'Filament near end of life, emission regulation, carrier pressure or flow oscillating, source temperature cycling, or charging of contaminated insulators or lenses.', [
      'Clean the source by the procedure if insulators or lenses are contaminated; change the filament if it is near end of life.',
    ], 'the RSD of the same ion', { access: 'covers-off', hazards: ['venting', 'hot-surface', 'chemical'], cards: ['lockout', 'vacuum', 'hot-surface', 'chemical'] }),
    leaf('NU6-esi', 'Electrospray', 'LC pump pulsation (noise period equal to the pump stroke), bubbles, emitter damage or position, flow too low for the voltage, gas flow, or discharge in negative mode.', [
      'Degas the eluent; lower the voltage if it discharges.',
    ], 'the RSD of the same ion', { hazards: ['high-voltage', 'chemical'], cards: ['high-voltage', 'chemical'] }),
    gate('NU6-apci-G', 'covers-off', USER_MAINTENANCE, ['high-voltage', 'stored-charge', 'hot-surface', 'lockout'], 'NU6-apci', 'NU-stop', 'Gate: corona needle', 'The next step opens the APCI source: corona supply and power locked out, discharged, source cool.'),
    leaf('NU6-apci', 'APCI', 'The corona needle is worn or contaminated.', ['Clean or replace it by the procedure.'], 'the corona current and the RSD', { access: 'covers-off', hazards: ['high-voltage', 'stored-charge', 'hot-surface'], cards: ['high-voltage', 'stored-charge', 'hot-surface', 'lockout'] }),
    leaf('NU6-rga', 'Residual gas analyser', 'Compare with an independent total-pressure gauge: the process pressure may really be fluctuating.', [
      'If it is the analyser, log the noise metrics and the spectrum and escalate.',
    ], 'the partial pressure and the total pressure together'),
    leaf('NU-stop', 'Stop and escalate', STOP_TEXT, ['Leave the instrument as it is; pass this walk to someone authorised for the step.'], 'nothing further here; record the noise figures for whoever takes over', {
      escalate: true,
      cards: ['general'],
    }),
  ],
};
