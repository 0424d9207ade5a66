import type { Tree } from '../types';
import { gate, leaf, opt, STOP_TEXT, USER_MAINTENANCE } from './build';

/** High background or suspected air or water leak. The Leak check panel computes the ratios from peak heights. */
export const leakTree: Tree = {
  id: 'leak',
  title: 'High background or suspected air/water leak',
  summary: 'Read the background spectrum, tell water, air, CO/N2, CO2 and chemical background apart, then find where air gets in.',
  entry: 'HB1',
  nodes: [
    {
      id: 'HB1',
      kind: 'choice',
      title: 'Which kind of instrument?',
      text: 'A spray source admits air by design, so air ratios do not apply there.',
      options: [{ ...opt('ei', 'EI GC-MS or residual gas analyser', 'HB2'), fits: ['gc-ms-single', 'gc-ms-triple', 'rga'] }, { ...opt('api', 'Spray-source LC-MS', 'HBAPI'), fits: ['lc-ms-single', 'lc-ms-triple'] }],
    },
    {
      id: 'HBAPI',
      kind: 'choice',
      title: 'Which problem?',
      text: 'Chemical background in the spectrum, or a leak on the vacuum side?',
      options: [opt('chem', 'Chemical background', 'HBAPI-chem-q'), opt('vac', 'Analyser pressure high', 'HBAPI-vac')],
    },
    {
      id: 'HBAPI-chem-q',
      kind: 'question',
      title: 'Chemical background: is it in the solvents or gases?',
      text: 'Identify the series. 44 u spacing: polyethers; 74 u spacing: polysiloxanes (common practice); plasticiser ions; sodium or potassium adducts; solvent clusters. Then check solvent and additive quality, LC contamination and gas purity.',
      options: [opt('found', 'Found in the solvents, additives or gases', 'HBAPI-supply'), opt('source', 'Supplies clean: the source itself is contaminated', 'HBAPI-chem-G')],
    },
    leaf('HBAPI-supply', 'Contaminated supplies', 'Replace the contaminated solvent, additive or gas supply and flush the LC path.', [
      'Follow the safety data sheets; change cylinders by the site’s gas rules.',
    ], 'a blank spectrum against the baseline background', { access: 'covers-on', hazards: ['chemical', 'gas-cylinder'], cards: ['chemical', 'gas'] }),
    gate('HBAPI-chem-G', 'covers-off', USER_MAINTENANCE, ['lockout', 'stored-charge', 'hot-surface', 'chemical'], 'HBAPI-chem', 'HB-stop', 'Gate: spray source cleaning', 'The next step opens and cleans the spray source: spray voltage and power locked out, discharged, source cool, solvents at hand.'),
    leaf('HBAPI-chem', 'Chemical background', 'Clean the source by the maker’s procedure.', [
      'Spray voltage and power locked out and the source cool before you open it.',
      'Use the cleaning solvents with ventilation and nitrile gloves.',
    ], 'a blank spectrum against the baseline background', { access: 'covers-off', hazards: ['stored-charge', 'hot-surface', 'chemical'], cards: ['lockout', 'stored-charge', 'hot-surface', 'chemical'] }),
    leaf('HBAPI-vac', 'Vacuum-side leak', 'Go to the vacuum tree.', ['Record the analyser and interface pressures first.'], 'the analyser pressure', { continueWith: ['vacuum'] }),
    {
      id: 'HB2',
      kind: 'choice',
      title: 'Which peak dominates the background?',
      text: 'Record a background spectrum with no sample: heights at m/z 2, 4, 12, 14, 16, 17, 18, 28, 32, 40, 44 and any recurring high peaks (e.g. 69, 73, 149). The Leak check panel turns the heights into ratios.',
      options: [opt('18', 'm/z 18 (water)', 'HB3'), opt('28', 'm/z 28', 'HB4'), opt('other', 'Something else', 'HB7')],
    },
    {
      id: 'HB3',
      kind: 'question',
      title: 'Water: vented or cleaned lately?',
      text: 'Was the system vented or cleaned within the last one to three days (common practice)? For water, m/z 17 is about 20–26 % of m/z 18 (from memory).',
      options: [opt('yes', 'Yes', 'HB3a'), opt('no', 'No recent vent', 'HB3-carrier')],
    },
    {
      id: 'HB3a',
      kind: 'question',
      title: 'Is m/z 18 falling like 1/t?',
      text: 'Log m/z 18 (or the pressure) against time since pump-down. Outgassing water falls about as 1/t, so p·t stays roughly constant; a leak leaves a floor. The Leak check panel fits p = A/t + B.',
      options: [opt('yes', 'Yes, falling as 1/t', 'HB3-outgas'), opt('no', 'No, it stays up', 'HB3-persist')],
    },
    leaf('HB3-outgas', 'Normal outgassing', 'Water from surfaces exposed during the vent.', ['Keep pumping, or bake by the procedure. Log the decay.'], 'm/z 18 and the analyser pressure at the next milestone (e.g. 4 h and 24 h)', {
      hazards: ['hot-surface'],
      cards: ['hot-surface'],
    }),
    leaf('HB3-persist', 'Persistent water', 'Water keeps coming in or off something.', [
      'Check the carrier-gas moisture trap and gas lines, cleaning solvent or water trapped in parts, and any water-cooled component.',
    ], 'm/z 18 and 17/18 against the baseline', { access: 'covers-on', hazards: ['gas-cylinder'], cards: ['gas'] }),
    leaf('HB3-carrier', 'Moisture without a recent vent', 'Moisture in the carrier (exhausted trap, new cylinder, lines), or a small leak.', [
      'Check the trap and the cylinder connection; then check 28:32 as for a suspected air leak.',
    ], 'm/z 18 and the 28:32 ratio', { access: 'covers-on', hazards: ['gas-cylinder'], cards: ['gas'] }),
    {
      id: 'HB4',
      kind: 'measure',
      title: 'm/z 28 is large: is it air?',
      text: 'Divide the height at m/z 28 by the height at m/z 32.',
      points: [
        'Dry air is N2 78.084 %, O2 20.946 %, Ar 0.934 % by volume (CRC; U.S. Standard Atmosphere 1976): N2/O2 = 3.73.',
        'An air leak shows 28:32 of about 3.7–4 (common practice); treat about 3–5 as air-like (from memory). A hot filament eats O2 and raises the ratio.',
      ],
      measure: { visitType: 'air-ratio-28-32', quantity: '28:32 peak-height ratio', unit: '1', tool: 'Background scan (Leak check panel)', how: 'Heights at m/z 28 and 32 from the same scan.' },
      expect: { range: { low: 3.7, high: 4 }, tolerance: { kind: 'range', borderline: 0, outer: { low: 3, high: 5 } }, source: '3.7–4 common practice; 3–5 from memory.' },
      branches: { pass: 'HB4-ar', borderline: 'HB4-ar', high: 'HB4-co', low: 'HB4-notair' },
    },
    {
      id: 'HB4-ar',
      kind: 'measure',
      title: 'Does argon agree?',
      text: 'Divide the height at m/z 40 by the height at m/z 28.',
      points: ['Ar/N2 in air is 0.0120; weighted by ionisation (Bayard–Alpert sensitivities as a proxy) about 1.7 % (computed from CRC values).'],
      measure: { quantity: '40:28 peak-height ratio', unit: '%', tool: 'Background scan (Leak check panel)', how: 'Heights at m/z 40 and 28 from the same scan.' },
      expect: { range: { low: 1, high: 2 }, tolerance: { kind: 'range', borderline: 0, outer: { low: 0.5, high: 3 } }, source: 'About 1–2 % for air: Ar/N2 0.0120 (U.S. Standard Atmosphere 1976, Table 3) weighted by Bayard–Alpert relative sensitivities (CRC Handbook of Chemistry and Physics, ion-gauge table; computed); 0.5–3 % borderline (common practice).' },
      branches: { pass: 'HB5', borderline: 'HB5', high: 'HB4-mix', low: 'HB4-mix' },
    },
    leaf('HB4-mix', 'Air-like 28:32 but argon does not fit', 'Another gas is mixed in (an argon tracer still present, argon carrier, a nitrogen and oxygen source).', [
      'Wait for any tracer to clear and take the spectrum again before calling it air.',
    ], 'the 28:32 and 40:28 ratios'),
    {
      id: 'HB4-co',
      kind: 'choice',
      title: 'Little m/z 32: what else is at 28?',
      text: 'Look at m/z 44, 14 and 12.',
      options: [opt('co2', 'm/z 44 large as well', 'HB4-co2'), opt('co', 'm/z 14 small and 12 present', 'HB4-coN2'), opt('n2', 'm/z 14 clearly present (N2)', 'HB4-coN2')],
    },
    leaf('HB4-co2', 'Carbon dioxide', 'CO2 and its CO fragment: dry ice nearby, contaminated carrier or organic decomposition.', ['Find the source (dry ice nearby, a contaminated carrier) and deal with it; check the carrier purity.'], 'm/z 44 and 28 against the baseline', {
      access: 'covers-on',
      hazards: ['gas-cylinder'],
      cards: ['gas'],
    }),
    leaf('HB4-coN2', 'CO or nitrogen, not air', 'Mostly CO from hot-filament reactions or outgassing after a bake or filament change (it decays), or N2 from a nitrogen source (vent gas, purge lines, generator).', [
      'Check the vent and purge valves; watch whether m/z 28 decays.',
    ], 'm/z 28, 14 and 12 after an hour', { access: 'covers-on', hazards: ['gas-cylinder'], cards: ['gas'] }),
    leaf('HB4-notair', 'Not air: too much m/z 32', 'Look for an oxygen source (a gas line) or methanol (strong m/z 31).', ['Check gas lines and recent cleaning solvents.'], 'the 28:32 ratio and m/z 31', {
      access: 'covers-on',
      hazards: ['gas-cylinder', 'chemical'],
      cards: ['gas', 'chemical'],
    }),
    {
      id: 'HB5',
      kind: 'question',
      title: 'Is the air coming with the carrier?',
      text: 'Change the carrier flow briefly and watch m/z 28, 32 and 40.',
      options: [opt('follows', 'The air signal follows the carrier flow', 'HB5-up'), opt('steady', 'It does not follow', 'HB5b-G')],
    },
    gate('HB5b-G', 'covers-off', USER_MAINTENANCE, ['lockout', 'vacuum', 'hot-surface'], 'HB5b', 'HB-stop', 'Gate: blank the interface', 'Blanking the MS interface with a no-hole ferrule or cap needs a vent and a cool source.'),
    {
      id: 'HB5b',
      kind: 'question',
      title: 'With the interface blanked, is the air gone?',
      text: 'Vent, blank the interface by the procedure, pump down and take the background again.',
      access: 'covers-off',
      hazards: ['venting', 'hot-surface'],
      cards: ['lockout', 'vacuum', 'hot-surface'],
      options: [opt('gone', 'Air gone: the leak is upstream', 'HB5-up'), opt('stays', 'Air still there: the leak is on the MS side', 'HB6')],
    },
    leaf('HB5-up', 'Leak upstream of the MS', 'Leak-check the gas lines and fittings, replace exhausted traps, purge new cylinder connections, check inlet seals.', [
      'Use leak-detection liquid only on pressurised joints.',
    ], 'the 28:32 ratio and m/z 18/28 against the baseline', { access: 'covers-on', hazards: ['gas-cylinder'], cards: ['gas'] }),
    {
      id: 'HB6',
      kind: 'question',
      title: 'Tracer at one joint: did the tracer ion respond?',
      text: 'Spray a short burst of tracer at one joint, wait several seconds, and let the signal clear before moving on. Argon (watch m/z 40) sinks: start low and work up. Helium (m/z 4, only if helium is not the carrier) rises: start high and work down.',
      points: [
        'Usual suspects (common practice): column or transfer-line nut (ferrules shrink after heat cycles), vent valve seal, analyser door or side-plate O-ring, calibrant valve, gauge fittings and feedthroughs, KF clamps with a misaligned centring ring, viewports.',
        'Never use a flammable tracer. Keep the nozzle away from exposed live parts and HV feedthroughs; do not spray into a confined space.',
      ],
      access: 'covers-on',
      hazards: ['tracer-gas', 'gas-cylinder', 'high-voltage'],
      cards: ['tracer', 'gas', 'high-voltage'],
      options: [
        opt('found', 'Yes: this joint leaks', 'HB6-found-G'),
        { id: 'next-joint', label: 'No: try the next joint', next: 'HB6', loop: { max: 20 } },
        opt('none', 'No: every joint tried', 'HB6-none'),
      ],
    },
    gate('HB6-found-G', 'covers-off', USER_MAINTENANCE, ['vacuum', 'lockout', 'hot-surface'], 'HB6-found', 'HB-stop', 'Gate: reseal the joint', 'The next step opens the leaking joint: shut down and locked out, parts cool, vented through the designated valve.'),
    leaf('HB6-found', 'Leak found', 'Clean or replace the seal. Use no grease unless specified; handle lint-free.', [
      'Re-test the joint after pump-down: the tracer response should be gone.',
    ], 'the tracer response at the joint, and 28:32 and 18/28 against the baseline, before and after', { access: 'covers-off', hazards: ['venting', 'hot-surface'], cards: ['vacuum', 'lockout', 'hot-surface'] }),
    leaf('HB6-none', 'Leak not found with the tracer', 'Use a rate-of-rise test on isolable volumes (Leak check panel), or a helium leak detector (ISO 20485:2017, from memory), then escalate.', [
      'A rise that stays linear is a leak; one that levels off is outgassing or a virtual leak.',
    ], 'the rate of rise and the 28:32 ratio', { escalate: true, access: 'covers-on', hazards: ['venting'], cards: ['vacuum'] }),
    {
      id: 'HB7',
      kind: 'choice',
      title: 'Which signature?',
      text: 'Match the recurring ions.',
      options: [
        opt('hc', 'Hydrocarbon series (41, 43, 55, 57, 69, 71 … 14 u apart)', 'HB7-oil-G'),
        opt('si', 'Siloxanes (73, 147, 207, 281, 355)', 'HB7-si'),
        opt('pf', 'Fluorinated ions (69, 119, 131, 169, 219 …)', 'HB7-pf'),
        opt('ph', 'm/z 149 (phthalate)', 'HB7-ph'),
        opt('solv', 'Cleaning solvents (e.g. acetone 43/58, methanol 31/32, 2-propanol 45)', 'HB7-solv'),
      ],
    },
    gate('HB7-oil-G', 'covers-off', USER_MAINTENANCE, ['lockout', 'vacuum', 'hot-surface', 'chemical'], 'HB7-oil', 'HB-stop', 'Gate: foreline trap and contaminated parts', 'The next step opens the foreline trap and cleans contaminated parts: shut down and locked out, parts cool, vented through the designated valve.'),
    leaf('HB7-oil', 'Oil or hydrocarbons', 'Oil back-streaming (foreline, rough-pump oil, wrong venting), fingerprints or solvents.', ['Clean the contaminated parts by the procedure; check the foreline trap and the venting sequence.'], 'a blank background spectrum', {
      access: 'covers-off',
      hazards: ['venting', 'hot-surface', 'chemical'],
      cards: ['lockout', 'vacuum', 'hot-surface', 'chemical'],
    }),
    leaf('HB7-si', 'Siloxanes', 'Column bleed, septum or silicone grease.', ['Condition or replace the column or septum once the inlet and oven are cool; remove silicone.'], 'a blank background spectrum', { access: 'covers-on', hazards: ['hot-surface'], cards: ['hot-surface'] }),
    leaf('HB7-pf', 'Fluorinated background', 'The calibrant valve leaks or sticks open, or perfluoropolyether oil or grease is present.', ['Check the calibrant valve; find the fluid.'], 'a blank background spectrum with the calibrant closed', {
      access: 'covers-on',
      hazards: ['chemical'],
      cards: ['chemical'],
    }),
    leaf('HB7-ph', 'Plasticiser', 'Plastics or gloves touch the sample path.', ['Replace the plastic parts in the sample path; change glove type.'], 'a blank background spectrum', { access: 'covers-on', hazards: ['chemical'], cards: ['chemical'] }),
    leaf('HB7-solv', 'Cleaning solvent', 'Solvent left in parts.', ['Pump or bake longer; dry parts better next time.'], 'a blank background spectrum', { access: 'covers-on', hazards: ['hot-surface', 'chemical'], cards: ['hot-surface', 'chemical'] }),
    leaf('HB-stop', 'Stop and escalate', STOP_TEXT, ['Continue with the tracer only if the interface can stay in place; otherwise pass this walk on.'], 'nothing further here; record the background ratios for whoever takes over', {
      escalate: true,
      cards: ['general'],
    }),
  ],
};
