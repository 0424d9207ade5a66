import type { Tree } from '../types';
import { BEHIND_COVERS, gate, leaf, opt, STOP_TEXT, USER_MAINTENANCE } from './build';

/** Poor resolution or peak shape: split, tailing or wide peaks, in the mass spectrum or in the chromatogram. */
export const peakShapeTree: Tree = {
  id: 'peak-shape',
  title: 'Poor resolution or peak shape',
  summary: 'Tell chromatographic from mass-spectral shape problems, then measure widths and trace them to resolution setting, DC/RF tracking, fringe fields, alignment or pressure.',
  entry: 'PS1',
  nodes: [
    {
      id: 'PS1',
      kind: 'choice',
      title: 'Signal against m/z, or against time?',
      text: 'Is the bad shape in the mass-spectral profile or in the chromatographic peak?',
      options: [opt('time', 'Chromatographic peak (signal against time)', 'PSC1'), opt('mz', 'Mass-spectral profile (signal against m/z)', 'PS2')],
    },
    {
      id: 'PSC1',
      kind: 'choice',
      title: 'Which chromatographic pattern?',
      text: 'Pick the pattern that matches.',
      options: [
        opt('all-broad', 'All peaks broad or tailing, inert compounds too', 'PSC-phys'),
        opt('polar', 'Only active or polar compounds tail', 'PSC-act-G'),
        opt('split', 'Split peaks', 'PSC-split'),
        opt('front', 'Fronting', 'PSC-over'),
      ],
    },
    leaf('PSC-phys', 'Physical cause', 'Something in the flow path broadens every peak.', [
      'Column installation depth at the inlet and at the MS; dead volume; flow too low.',
      'A cold spot: transfer line below the elution temperature, source too cold. Compare the temperature read-backs with their set points.',
      'LC: extra-column volume or a void in the column.',
    ], 'peak width of a reference compound', { access: 'covers-on', hazards: ['hot-surface'], cards: ['hot-surface'] }),
    gate('PSC-act-G', 'covers-off', USER_MAINTENANCE, ['lockout', 'vacuum', 'hot-surface', 'chemical'], 'PSC-act', 'PS-stop', 'Gate: inlet, column and EI source', 'The next step replaces the liner, trims the column and cleans the EI source: power locked out, inlet and source cool, MS vented.'),
    leaf('PSC-act', 'Chemical activity', 'Active sites hold back polar compounds.', ['Replace the liner, trim the column, clean the EI source by the procedure.'], 'tailing factor of an active compound', {
      access: 'covers-off',
      hazards: ['venting', 'hot-surface', 'chemical'],
      cards: ['lockout', 'vacuum', 'hot-surface', 'chemical'],
    }),
    leaf('PSC-split', 'Injection or column', 'Injection solvent or strength mismatch, injection technique, or a void in the column.', ['Fix the injection conditions; replace the column if it has a void, once it is cool.'], 'the peak shape of a reference injection', {
      access: 'covers-on',
      hazards: ['hot-surface', 'chemical'],
      cards: ['hot-surface', 'chemical'],
    }),
    leaf('PSC-over', 'Overload', 'Too much sample for the column.', ['Dilute, or raise the split ratio.'], 'the peak shape at the lower load'),
    {
      id: 'PS2',
      kind: 'measure',
      title: 'Profile the calibrant',
      text: 'Profile scan three or more calibrant ions across the range (e.g. EI m/z 69, 219, 502) with at least about 10 points per u. Enter the width of the worst one here.',
      points: ['Look also at symmetry and the 10 % valley between neighbouring peaks (IUPAC 2013 definitions).'],
      measure: { quantity: 'Peak width (FWHM), worst of the ions', unit: 'u', tool: 'Profile scan', how: 'Full width at half maximum from the profile data.' },
      expect: { range: { low: 0.5, high: 0.8 }, tolerance: { kind: 'range', borderline: 0.34 }, source: 'About 0.5–0.8 u FWHM for unit resolution (common practice).' },
      branches: { pass: 'PS2q', borderline: 'PS2q', high: 'PS3', low: 'PS-narrow' },
    },
    leaf('PS-narrow', 'Peaks narrower than unit resolution', 'Transmission falls steeply as resolution rises; sensitivity pays for it.', ['Run the resolution calibration to the intended width.'], 'peak widths at the same ions', {
      continueWith: ['sensitivity'],
    }),
    {
      id: 'PS2q',
      kind: 'choice',
      title: 'What do the other ions show?',
      text: 'Compare widths and shapes across the ions you profiled.',
      options: [
        opt('fine', 'Widths and shapes are right everywhere', 'PS-ok'),
        opt('varies', 'Width changes with m/z', 'PS4'),
        opt('shape', 'Split, shouldered or tailing', 'PS5'),
        opt('ragged', 'Ragged or noisy', 'PS-noise'),
        opt('tandem', 'Tandem instrument: not yet known which stage', 'PS6'),
      ],
    },
    leaf('PS-ok', 'Shape within specification', 'The profile is fine at the ions checked.', ['Record the widths; if the complaint remains, look at the chromatography (the step *Signal against m/z, or against time?*).'], 'widths at the same ions for the record'),
    leaf('PS-noise', 'Ragged profile', 'A ragged profile is a noise problem.', ['Follow the noise tree.'], 'the profile at the same ion after the noise fix', { continueWith: ['noise'] }),
    {
      id: 'PS3',
      kind: 'measure',
      title: 'Too wide everywhere: is the resolving DC right?',
      text: 'Park at a calibrant m/z and read the DC of one rod pair. It should sit just below the apex value for that m/z.',
      points: ['Resolution R ≈ 0.126/(0.16784 − U/V) (Miller and Denton 1986): a DC/RF ratio error of about 1×10⁻⁴ changes the width noticeably.'],
      measure: { visitType: 'dc-amplitude', quantity: 'DC read-back at the parked m/z', unit: 'V', tool: 'Instrument read-back', how: 'Park the mass; read the DC of one pair in the instrument’s convention. No meter on the rods while RF is present.' },
      expect: {
        calc: 'dcAtMass',
        inputs: [{ key: 'mz', label: 'Parked m/z', unit: 'u', default: 219, min: 1, max: 10000 }],
        tolerance: { kind: 'relative', pass: 0.02, borderline: 0.05 },
      },
      source: 'U from a = 8eU/(m r0² Ω²) at the apex (Dawson 1976); a resolving scan line sits 0.1–1 % below; ±2 % is our working tolerance.',
      branches: { pass: 'PS3-cal', borderline: 'PS3-cal', low: 'PS3-dc-G', high: 'PS3-cal' },
    },
    leaf('PS3-cal', 'Resolution calibration', 'Run the resolution calibration.', [
      'If the analyser pressure is high, fix the vacuum first (scattering widens peaks).',
      'If the ion energy (rod offset) is high, reduce it: slower ions see more RF cycles and resolve better.',
    ], 'peak widths at the same three ions', { continueWith: ['vacuum'] }),
    gate('PS3-dc-G', 'covers-off', BEHIND_COVERS, ['lockout', 'stored-charge', 'high-voltage'], 'PS3-dc', 'PS-stop', 'Gate: DC supply with the power off', 'The next step tests and replaces the DC supply: power locked out, discharge time passed, absence of voltage proved.'),
    leaf('PS3-dc', 'DC too low', 'The DC read-back is below what the apex needs: suspect the DC supply.', ['Test the DC supply by the maker’s procedure (live tests only as it allows and your authorisation covers); replace it with the power locked out, or escalate.'], 'DC at the parked m/z and peak widths', {
      access: 'covers-off',
      hazards: ['stored-charge', 'high-voltage'],
      cards: ['lockout', 'stored-charge', 'high-voltage'],
      escalate: true,
    }),
    leaf('PS4', 'Width varies with m/z', 'The DC/RF scan line (slope and offset) is off.', [
      'Recalibrate resolution across the range.',
      'If it will not hold, suspect the DC/RF tracking electronics; escalate.',
    ], 'peak widths at low, middle and high m/z', { escalate: true }),
    {
      id: 'PS5',
      kind: 'choice',
      title: 'Split, shoulder or tail: which condition fits?',
      text: 'Pick the condition that matches what you see.',
      options: [
        opt('energy', 'Shape changes with ion energy or entrance-lens voltage', 'PS5-fringe-G'),
        opt('handled', 'Appeared after the analyser was handled, bumped or shipped', 'PS5-mech'),
        opt('dc', 'The two rod pairs’ DC read-backs differ in size', 'PS5-dc'),
        opt('pressure', 'Tails on every mass, and the pressure is high', 'PS5-press'),
        opt('intense', 'Only at very high intensity', 'PS5-sat'),
      ],
    },
    gate('PS5-fringe-G', 'covers-off', BEHIND_COVERS, ['lockout', 'stored-charge', 'vacuum', 'hot-surface', 'chemical'], 'PS5-fringe', 'PS-stop', 'Gate: entrance lens and pre-filter', 'The next step opens the analyser entrance: power locked out, discharged, source cool, vented through the designated valve.'),
    leaf('PS5-fringe', 'Entrance fringe field or contamination', 'Clean the pre-filter or entrance lens by the procedure.', ['Rod cleaning is escalated.'], 'profiles at the same ions and ion energies', {
      access: 'covers-off',
      hazards: ['stored-charge', 'venting', 'hot-surface', 'chemical'],
      cards: ['lockout', 'stored-charge', 'vacuum', 'hot-surface', 'chemical'],
    }),
    leaf('PS5-mech', 'Mechanical misalignment', 'The rods have moved.', ['Escalate for realignment at the maker’s level; do not adjust the rods in the field.'], 'profiles at the same ions, for the hand-over', { escalate: true }),
    leaf('PS5-dc', 'DC supply imbalance', 'The DC supply needs calibration or repair.', ['Follow the maker’s DC calibration; escalate repair.'], 'DC of both pairs at a parked m/z and the profiles', { escalate: true }),
    leaf('PS5-press', 'Collisional scattering', 'Residual gas scatters ions into tails.', ['Fix the vacuum first.'], 'the analyser pressure and the profiles', { continueWith: ['vacuum'] }),
    leaf('PS5-sat', 'Saturation or space charge', 'The detector or the ion beam is overloaded.', ['Reduce the signal and check the shape again.'], 'the profile at the lower signal'),
    leaf('PS6', 'Find the stage', 'Scan each quadrupole with the other in RF-only to see which one has the bad profile.', [
      'Then check that stage as in the DC, scan-line and shape steps above.',
    ], 'profiles from each stage'),
    leaf('PS-stop', 'Stop and escalate', STOP_TEXT, ['Leave the instrument closed; pass this walk to someone authorised for the step.'], 'nothing further here; record the profiles and widths for whoever takes over', {
      escalate: true,
      cards: ['general'],
    }),
  ],
};
