/**
 * Safety cards as data. Each names its hazards, the precautions, the standards it rests on, and ends with the
 * same deferral. Tree steps that carry a hazard must carry the matching card (checked by treeProblems).
 */
import type { GateItem, GateWork, Hazard, SafetyCard, SafetyCardId } from './types';

/**
 * What a gate asks before each kind of work. De-energised work behind covers: lockout/isolation and the release
 * of stored energy (discharge wait, cool-down, vent). Live work: authorisation for live work and measuring
 * equipment rated for the voltage present, and no lockout, because the instrument is meant to be on.
 * General gates (covers on) ask role, PPE and procedure at least.
 */
export const GATE_ASKS: Record<GateWork, readonly GateItem[]> = {
  'covers-off': ['role', 'lockout', 'discharge', 'ppe', 'procedure'],
  energised: ['role', 'live-work', 'meter-rating', 'ppe', 'procedure'],
  'covers-on': ['role', 'ppe', 'procedure'],
};

/** What a gate must not ask before each kind of work (a lockout cannot be applied to an instrument that must run). */
export const GATE_MUST_NOT_ASK: Record<GateWork, readonly GateItem[]> = {
  'covers-off': ['live-work', 'meter-rating'],
  energised: ['lockout', 'discharge'],
  'covers-on': [],
};

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
  'tracer-gas': 'tracer',
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
    sources: [
      'NFPA 70E, 2024 edition, Art. 100 (qualified person; from memory)',
      'IEC 61010-1:2010 (3rd ed.) and IEC 61010-2-081:2019 (laboratory equipment safety; from memory)',
    ],
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
      'OSHA 29 CFR 1910.147 (control of hazardous energy), as in force 2024 (from memory)',
      'ANSI/ASSP Z244.1-2016 (R2020) (from memory)',
      'ISO 14118:2017 (prevention of unexpected start-up; from memory)',
      'EN 50110-1:2013 (five safety rules; from memory)',
      'NFPA 70E, 2024 edition, Art. 120 (electrically safe work condition; from memory)',
    ],
    deferral: DEFERRAL,
  },
  {
    id: 'high-voltage',
    title: 'High voltage',
    hazards: [
      'Multiplier supplies of kilovolts; conversion dynodes up to about ±15 kV; spray needles of several kilovolts; lens supplies of hundreds of volts; mains (common practice).',
      'In dry locations a part is treated as hazardous live above 33 V rms, 46.7 V peak or 70 V DC; wet locations 16 V rms, 22.6 V peak, 35 V DC (IEC 61010-1:2010 (3rd ed.) cl. 6.3.1 a) and 6.3.2, from memory).',
    ],
    precautions: [
      'Measure kilovolt supplies only at the designated test points, with a divider probe rated for the voltage, and only as live work you are authorised for.',
      'Use meters and probes rated for the voltage and measurement category (e.g. CAT II 1000 V; categories of IEC 61010-2-033:2017, from memory); a 1000 V meter must not touch kilovolt parts.',
      'For work with covers off, lock out, wait the discharge time and prove the absence of voltage first.',
      'Keep outside the approach boundaries for exposed live parts unless qualified and protected.',
      "Never lift an oscilloscope's protective earth; use rated differential probes.",
      'Do not defeat the interlocks of a spray source.',
    ],
    sources: [
      'IEC 61010-1:2010 (3rd ed.) cl. 6.3.1 a) and 6.3.2 (hazardous live levels; from memory)',
      'NFPA 70E, 2024 edition, Table 130.4(E)(a) (approach boundaries; from memory)',
      'IEC 61010-2-033:2017 (hand-held meters) and IEC 61010-031:2015 (probe assemblies; from memory)',
    ],
    deferral: DEFERRAL,
  },
  {
    id: 'rf',
    title: 'RF on rods and ion guides',
    hazards: [
      'Hundreds to thousands of volts zero-to-peak at about 1 MHz on the rods (Dawson, Quadrupole Mass Spectrometry and its Applications, 1976, the scan law).',
      'Above about 100 kHz current burns with little warning sensation (IEC TS 60479-2:2017, from memory); arcs jump small gaps.',
      'A probe adds capacitance, detunes the RF circuit and shifts the mass scale.',
    ],
    precautions: [
      'Read RF only at a monitor point, or with a low-capacitance probe rated for the voltage at that frequency (ratings fall with frequency).',
      'Clip probes on with the power off; keep hands clear while energised.',
      'Take every probe off before closing up.',
      'For frequency alone, use a loosely coupled pickup loop.',
    ],
    sources: [
      'IEC TS 60479-2:2017 (effects of current: frequencies above 100 Hz; from memory)',
      'IEEE C95.1-2019 (RF exposure limits)',
      'ICNIRP, Guidelines for limiting exposure to electromagnetic fields (100 kHz to 300 GHz), Health Physics 118 (2020)',
    ],
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
    sources: [
      'IEC 61010-1:2010 (3rd ed.) cl. 6.3.1 c) (stored-charge limits; from memory)',
      'EN 50110-1:2013 (from memory)',
      'NFPA 70E, 2024 edition, Art. 360 (capacitors; from memory)',
    ],
    deferral: DEFERRAL,
  },
  {
    id: 'vacuum',
    title: 'Vacuum, venting and implosion',
    hazards: [
      'Atmosphere presses about 800 N on a 100 mm viewport (101.325 kPa of ISO 2533:1975 × the 7.85×10⁻³ m² of the port; computed).',
      'Clamps, viewports, bellows and gauge tubes are not rated for pressure above atmosphere.',
    ],
    precautions: [
      'Vent only through the designated valve, with dry gas at low regulated pressure.',
      'Never pressurise above atmosphere; an unregulated cylinder can burst a viewport.',
      'Guard and inspect glass; wear eye protection.',
    ],
    sources: [
      'EN 1012-2:1996+A1:2009 (vacuum pump safety; from memory)',
      'US DOE bulletin EH-92-2, Implosions under negative pressure (1992)',
      'UC Berkeley EHS lessons learned, vacuum chamber over-pressurization (2019)',
      'ISO 2533:1975 (standard atmosphere)',
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
    sources: ['ISO 27892:2010 (turbomolecular pumps, rapid shutdown torque; from memory)'],
    deferral: DEFERRAL,
  },
  {
    id: 'hot-surface',
    title: 'Hot surfaces and bake-out',
    hazards: [
      'Electron-ionisation sources 200–350 °C, transfer lines up to about 320 °C, spray-source heaters up to about 600 °C, bake-out 150–250 °C (common practice).',
      'Heater tapes are also an electrical and fire hazard.',
    ],
    precautions: ['Let parts cool (often 1–2 h for a source; common practice) before handling.', 'Wear heat-resistant gloves.'],
    sources: [
      'ISO 13732-1:2006 (hot surfaces, contact burns; from memory)',
      'IEC 61010-1:2010 (3rd ed.) cl. 10.1 (surface temperature limits; from memory)',
    ],
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
    sources: [
      'UN GHS, Rev. 10 (2023) (from memory)',
      'Regulation (EC) No 1272/2008 (CLP)',
      'OSHA 29 CFR 1910.1200 (hazard communication), 2012 revision (from memory)',
    ],
    deferral: DEFERRAL,
  },
  {
    id: 'gas',
    title: 'Gas cylinders, generators and tracer gases',
    hazards: [
      'Cylinders fall and regulators fail; hydrogen is flammable from 4 % in air (IEC 60079-20-1:2010, from memory).',
      'Nitrogen, argon and helium displace oxygen; below 19.5 % O2 an atmosphere is oxygen-deficient (OSHA 29 CFR 1910.134(b), from memory).',
      'Some tracer propellants are flammable or decompose on hot surfaces.',
    ],
    precautions: [
      'Secure cylinders upright, use the right regulator for the gas, cap them for transport.',
      'Put leak-detection liquid only on pressurised joints, never where vacuum can draw it in.',
      'Never spray a flammable tracer near hot sources or high voltage; use short bursts.',
      'Assess large nitrogen flows into small rooms and monitor oxygen where required.',
    ],
    sources: [
      'CGA P-1-2015 (safe handling of compressed gases; from memory)',
      'OSHA 29 CFR 1910.101 (compressed gases), as in force 2024 (from memory)',
      'OSHA 29 CFR 1910.134(b) (oxygen-deficient atmosphere), as in force 2024 (from memory)',
      'IEC 60079-20-1:2010 (flammability limits; from memory)',
    ],
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
    sources: ['EN 1012-2:1996+A1:2009 (vacuum pump safety; from memory)'],
    deferral: DEFERRAL,
  },
  {
    id: 'tracer',
    title: 'Tracer gas spraying',
    hazards: [
      'The spray is aimed at joints next to live parts: HV feedthroughs, gauge heads, multiplier and spray-source supplies. Helium and argon make arcs across feedthroughs easier (lower breakdown voltage than air; common practice).',
      'Helium and argon displace oxygen; in a small or confined room a long spray can lower the oxygen below 19.5 % (OSHA 29 CFR 1910.134(b), from memory).',
      'Flammable tracers (aerosol propellants, solvents, hydrogen mixtures classed as flammable) can ignite on hot sources or sparks.',
    ],
    precautions: [
      'Never use a flammable tracer. Use helium (only where helium is not the carrier) or argon, from a regulated cylinder with a fine nozzle.',
      'Keep the nozzle away from exposed live parts and HV feedthroughs; spray only at joints you can reach with covers on.',
      'Short bursts at low flow; let the signal clear between joints.',
      'Do not spray into a confined space; ventilate the room and monitor oxygen where the site requires it.',
      'Secure the cylinder upright.',
    ],
    sources: [
      'ISO 20485:2017 (leak detection, tracer gas method; from memory)',
      'OSHA 29 CFR 1910.134(b) (oxygen-deficient atmosphere), as in force 2024 (from memory)',
      'IEC 60079-20-1:2010 (flammability limits; from memory)',
      'CGA P-1-2015 (from memory)',
    ],
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
