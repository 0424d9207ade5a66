/**
 * Safety cards as data. Each names its hazards, the precautions, the standards it rests on, and ends with the
 * same deferral. Tree steps that carry a hazard must carry the matching card (checked by treeProblems).
 */
import type { Hazard, SafetyCard, SafetyCardId } from './types';

export const DEFERRAL =
  "Always follow the instrument maker's procedures for this model, the site's safety rules and permits, local codes and regulations, and licensed or authorised practice for electrical, gas and radiation work. This card is generic guidance and replaces none of them.";

/** Which card covers each hazard. */
export const HAZARD_CARD: Record<Hazard, SafetyCardId> = {
  'high-voltage': 'high-voltage',
  rf: 'rf',
  'stored-charge': 'stored-charge',
  venting: 'vacuum',
  vacuum: 'vacuum',
  rotating: 'turbo',
  'hot-surface': 'hot-surface',
  chemical: 'chemical',
  'gas-cylinder': 'gas',
  radioactive: 'radiation',
  lifting: 'mechanical',
};

const cards: SafetyCard[] = [
  {
    id: 'general',
    title: 'Before any work',
    hazards: ['Mains, high voltage, RF, heat, vacuum, compressed gas, rotating pumps and chemicals all meet in one instrument.'],
    precautions: [
      'Do only the steps you are trained and authorised for; "qualified person" in the electrical-safety sense.',
      "Have the maker's procedure for this exact model at hand.",
      'Never defeat an interlock. Do not work alone on exposed live circuits.',
      'Leave covers on unless the procedure needs them off.',
    ],
    sources: ['NFPA 70E (qualified person)', 'IEC 61010-1 and IEC 61010-2-081 (laboratory equipment safety)'],
    deferral: DEFERRAL,
  },
  {
    id: 'lockout',
    title: 'Lockout/tagout: control every energy source',
    hazards: [
      'Several mains cords (mass spectrometer, rough pump, chromatograph, nitrogen generator, chiller).',
      'Stored energy: capacitors, compressed gas, atmospheric load on vacuum parts, heat, spinning rotors.',
    ],
    precautions: [
      'Plan and tell the people affected; shut down by the procedure.',
      'Isolate every source, then lock and tag each isolation point.',
      'Release stored energy: let parts cool, vent, let rotors stop, bleed gas lines, discharge capacitors.',
      'Prove the absence of voltage with a rated tester, checked on a known live source before and after.',
      'Afterwards remove locks and restore power in order, telling the same people.',
      'Cord-and-plug equipment: unplugged, with the plug under your sole control.',
    ],
    sources: [
      'OSHA 29 CFR 1910.147 (control of hazardous energy)',
      'ANSI/ASSP Z244.1',
      'ISO 14118 (prevention of unexpected start-up)',
      'EN 50110-1 (five safety rules)',
      'NFPA 70E',
    ],
    deferral: DEFERRAL,
  },
  {
    id: 'high-voltage',
    title: 'High voltage',
    hazards: [
      'Multiplier supplies of kilovolts; conversion dynodes up to about ±15 kV; spray needles of several kilovolts; lens supplies of hundreds of volts; mains.',
      'In dry locations a part is treated as hazardous live above 33 V rms, 46.7 V peak or 70 V DC (lower limits apply in wet locations).',
    ],
    precautions: [
      'Measure kilovolt supplies only at the designated test points, with a divider probe rated for the voltage.',
      'Use meters and probes rated for the voltage and measurement category; a 1000 V meter must not touch kilovolt parts.',
      'Keep outside the approach boundaries for exposed live parts unless qualified and protected.',
      "Never lift an oscilloscope's protective earth; use rated differential probes.",
      'Do not defeat the interlocks of a spray source.',
    ],
    sources: [
      'IEC 61010-1 cl. 6.3 (hazardous live, recalled)',
      'NFPA 70E Table 130.4(E)(a) (approach boundaries)',
      'IEC 61010-2-033 (meters), IEC 61010-031 (probes)',
    ],
    deferral: DEFERRAL,
  },
  {
    id: 'rf',
    title: 'RF on rods and ion guides',
    hazards: [
      'Hundreds to thousands of volts zero-to-peak at about 1 MHz on the rods.',
      'Above about 100 kHz current burns with little warning sensation; arcs jump small gaps.',
      'A probe adds capacitance, detunes the RF circuit and shifts the mass scale.',
    ],
    precautions: [
      'Read RF only at a monitor point, or with a low-capacitance probe rated for the voltage at that frequency (ratings fall with frequency).',
      'Clip probes on with the power off; keep hands clear while energised.',
      'Take every probe off before closing up.',
      'For frequency alone, use a loosely coupled pickup loop.',
    ],
    sources: ['IEC TS 60479-2 (effects of current at higher frequencies)', 'IEEE C95.1-2019', 'ICNIRP guidelines 2020'],
    deferral: DEFERRAL,
  },
  {
    id: 'stored-charge',
    title: 'Stored charge',
    hazards: ['High-voltage capacitors, long HV cables and RF tank capacitors stay charged after switch-off.'],
    precautions: [
      'Wait the documented discharge time.',
      'Verify with a rated instrument before touching.',
      'Earth through a resistor-type earthing stick where the procedure allows.',
    ],
    sources: ['IEC 61010-1 (stored-charge limits, recalled)', 'EN 50110-1', 'NFPA 70E Art. 360 (recalled)'],
    deferral: DEFERRAL,
  },
  {
    id: 'vacuum',
    title: 'Vacuum, venting and implosion',
    hazards: [
      'Atmosphere presses about 800 N on a 100 mm viewport.',
      'Clamps, viewports, bellows and gauge tubes are not rated for pressure above atmosphere.',
    ],
    precautions: [
      'Vent only through the designated valve, with dry gas at low regulated pressure.',
      'Never pressurise above atmosphere; an unregulated cylinder can burst a viewport.',
      'Guard and inspect glass; wear eye protection.',
    ],
    sources: [
      'EN 1012-2 (vacuum pump safety)',
      'US DOE bulletin EH-92-2, Implosions under negative pressure (1992)',
      'UC Berkeley EHS lessons learned, vacuum chamber over-pressurization (2019)',
      'ISO 2533 (standard atmosphere)',
    ],
    deferral: DEFERRAL,
  },
  {
    id: 'turbo',
    title: 'Turbomolecular pumps',
    hazards: ['The rotor holds large kinetic energy; a seized or burst rotor twists its mounting hard.'],
    precautions: [
      'Mount exactly as specified.',
      'Do not move, tilt or knock a running pump; do not vent it suddenly at full speed unless the design allows.',
      'Allow for a long spin-down when unvented.',
    ],
    sources: ['ISO 27892 (turbomolecular pumps, rapid shutdown torque)'],
    deferral: DEFERRAL,
  },
  {
    id: 'hot-surface',
    title: 'Hot surfaces and bake-out',
    hazards: [
      'Electron-ionisation sources 200–350 °C, transfer lines up to about 320 °C, spray-source heaters up to about 600 °C, bake-out 150–250 °C (common practice).',
      'Heater tapes are also an electrical and fire hazard.',
    ],
    precautions: ['Let parts cool (often 1–2 h for a source) before handling.', 'Wear heat-resistant gloves.'],
    sources: ['ISO 13732-1 (hot surfaces, contact burns)', 'IEC 61010-1 cl. 10 (surface temperature limits, recalled)'],
    deferral: DEFERRAL,
  },
  {
    id: 'chemical',
    title: 'Chemicals',
    hazards: [
      'Pump oil can carry sample residues and solvents.',
      'Cleaning solvents (methanol, acetone, 2-propanol, acetonitrile) are flammable; methanol and acetonitrile are toxic.',
      'Calibrants contain acids, salts and fluorinated compounds; spray sources may be biohazardous.',
    ],
    precautions: [
      'Read the safety data sheet and the GHS/CLP label.',
      'Treat used pump oil as hazardous waste.',
      'Ventilate ultrasonic baths with flammable solvents; exhaust pumps and sources to extraction.',
      'Wear nitrile gloves (they also keep fingerprints off clean parts).',
    ],
    sources: ['UN GHS', 'Regulation (EC) No 1272/2008 (CLP)', 'OSHA 29 CFR 1910.1200 (hazard communication)'],
    deferral: DEFERRAL,
  },
  {
    id: 'gas',
    title: 'Gas cylinders, generators and tracer gases',
    hazards: [
      'Cylinders fall and regulators fail; hydrogen is flammable from 4 % in air.',
      'Nitrogen, argon and helium displace oxygen; below 19.5 % O2 an atmosphere is oxygen-deficient.',
      'Some tracer propellants are flammable or decompose on hot surfaces.',
    ],
    precautions: [
      'Secure cylinders upright, use the right regulator for the gas, cap them for transport.',
      'Put leak-detection liquid only on pressurised joints, never where vacuum can draw it in.',
      'Never spray a flammable tracer near hot sources or high voltage; use short bursts.',
      'Assess large nitrogen flows into small rooms and monitor oxygen where required.',
    ],
    sources: ['CGA P-1', 'OSHA 29 CFR 1910.101', 'OSHA 29 CFR 1910.134 (oxygen-deficient atmosphere)', 'IEC 60079-20-1 (flammability limits, recalled)'],
    deferral: DEFERRAL,
  },
  {
    id: 'radiation',
    title: 'Radioactive items',
    hazards: ['Some filament coatings and some detectors mounted beside a mass spectrometer contain radioactive material.'],
    precautions: ['Handle, store and dispose of them under the local radiation rules.'],
    sources: ['Local radiation-protection regulations'],
    deferral: DEFERRAL,
  },
  {
    id: 'mechanical',
    title: 'Lifting and mechanical',
    hazards: ['Pumps are heavy; hoses trip; belts and fans catch.'],
    precautions: ['Lift with help or aids; keep guards on; route hoses out of walkways.'],
    sources: ['EN 1012-2 (vacuum pump safety)'],
    deferral: DEFERRAL,
  },
];

export const SAFETY_CARDS: Record<SafetyCardId, SafetyCard> = Object.fromEntries(cards.map((c) => [c.id, c])) as Record<SafetyCardId, SafetyCard>;

/** Problems with the card set itself (missing card, missing sources, missing deferral). */
export function cardProblems(): string[] {
  const out: string[] = [];
  for (const id of new Set(Object.values(HAZARD_CARD))) if (!SAFETY_CARDS[id]) out.push(`Hazard card "${id}" is missing.`);
  for (const c of cards) {
    if (c.hazards.length === 0) out.push(`Card "${c.id}" names no hazard.`);
    if (c.precautions.length === 0) out.push(`Card "${c.id}" gives no precaution.`);
    if (c.sources.length === 0) out.push(`Card "${c.id}" names no source.`);
    if (c.deferral !== DEFERRAL) out.push(`Card "${c.id}" does not end with the deferral to the maker, the site, local codes and licensed practice.`);
  }
  return out;
}
