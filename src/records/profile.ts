// Instrument profile fields: display units, accepted ranges, parsing and validation.
// Pure: no storage here, so the form and the importer share one set of rules.
import { parseNumber } from './numberText';
import type { AmplitudeForm, AmplitudeReference, InstrumentKind, InstrumentProfile } from './types';

export interface NumericFieldSpec {
  key: 'rodFieldRadius' | 'rodLength' | 'rfFrequency' | 'maxRfAmplitude' | 'axialEnergy';
  label: string;
  /** Unit shown to the user. */
  unit: string;
  /** Multiply a display value by this to get SI. */
  toSi: number;
  min: number;
  max: number;
  help: string;
}

// Ranges are generous sanity limits for quadrupole mass filters and RGAs (common practice), not a
// maker's specification: they only stop typing slips such as 45 mm for 4.5 mm.
export const numericFields: readonly NumericFieldSpec[] = [
  { key: 'rodFieldRadius', label: 'Field radius r0', unit: 'mm', toSi: 1e-3, min: 0.5, max: 20,
    help: 'Distance from the axis to the rod surface (inscribed radius).' },
  { key: 'rodLength', label: 'Rod length', unit: 'mm', toSi: 1e-3, min: 10, max: 1000,
    help: 'Length of the mass-filter rods the ions travel through.' },
  { key: 'rfFrequency', label: 'RF frequency', unit: 'MHz', toSi: 1e6, min: 0.1, max: 20,
    help: 'Drive frequency f of the RF supply.' },
  { key: 'maxRfAmplitude', label: 'Largest RF amplitude', unit: 'V zero-to-peak, one rod to ground', toSi: 1, min: 10, max: 20000,
    help: 'The most the RF supply can deliver; it sets the top of the mass range.' },
  { key: 'axialEnergy', label: 'Ion axial energy', unit: 'eV', toSi: 1, min: 0.1, max: 100,
    help: 'Typical energy of ions entering the rods (set by the rod offset).' },
];

export const instrumentKinds: readonly { value: InstrumentKind; label: string }[] = [
  { value: 'gc-ms-single', label: 'GC-MS, single quadrupole' },
  { value: 'gc-ms-triple', label: 'GC-MS, triple quadrupole' },
  { value: 'lc-ms-single', label: 'LC-MS, single quadrupole' },
  { value: 'lc-ms-triple', label: 'LC-MS, triple quadrupole' },
  { value: 'rga', label: 'Residual gas analyser' },
];

export const amplitudeForms: readonly { value: AmplitudeForm; label: string }[] = [
  { value: 'zero-to-peak', label: 'zero-to-peak' },
  { value: 'peak-to-peak', label: 'peak-to-peak' },
  { value: 'rms', label: 'rms' },
];

export const amplitudeReferences: readonly { value: AmplitudeReference; label: string }[] = [
  { value: 'per-rod', label: 'one rod to ground' },
  { value: 'between-pairs', label: 'between the rod pairs' },
];

export const NAME_MAX = 80;
export const NOTES_MAX = 5000;

/** What the profile form holds: text as typed, so nothing the user typed is lost on a bad value. */
export interface ProfileDraft {
  name: string;
  kind: string;
  rodFieldRadius: string;
  rodLength: string;
  rfFrequency: string;
  maxRfAmplitude: string;
  axialEnergy: string;
  amplitude: string;
  reference: string;
  notes: string;
}

export type ProfileErrors = Partial<Record<keyof ProfileDraft, string>>;

/** Format an SI value for a form field in display units, without float noise (4.5 not 4.499999). */
export function toDisplay(spec: NumericFieldSpec, si: number): string {
  return String(Number((si / spec.toSi).toPrecision(10)));
}

export function draftFromProfile(p: InstrumentProfile): ProfileDraft {
  const d: ProfileDraft = {
    name: p.name,
    kind: p.kind,
    rodFieldRadius: '',
    rodLength: '',
    rfFrequency: '',
    maxRfAmplitude: '',
    axialEnergy: '',
    amplitude: p.readbackConvention.amplitude,
    reference: p.readbackConvention.reference,
    notes: p.notes,
  };
  for (const spec of numericFields) d[spec.key] = toDisplay(spec, p[spec.key]);
  return d;
}

export function emptyDraft(): ProfileDraft {
  return {
    name: '', kind: 'gc-ms-single', rodFieldRadius: '', rodLength: '', rfFrequency: '', maxRfAmplitude: '',
    axialEnergy: '', amplitude: 'zero-to-peak', reference: 'per-rod', notes: '',
  };
}

function rangeText(spec: NumericFieldSpec): string {
  return `between ${spec.min} and ${spec.max} ${spec.unit}`;
}

/** Check one numeric field; returns the SI value or a message naming the field and the accepted range. */
export function checkNumericField(spec: NumericFieldSpec, text: string): { value: number } | { error: string } {
  const v = parseNumber(text);
  if (text.trim() === '') return { error: `${spec.label} is empty: enter a value ${rangeText(spec)}.` };
  if (v === null) return { error: `${spec.label} “${text.trim()}” is not a number: enter a value ${rangeText(spec)}.` };
  if (v < spec.min || v > spec.max) {
    return { error: `${spec.label} ${text.trim()} ${spec.unit} is out of range: enter a value ${rangeText(spec)}.` };
  }
  return { value: v * spec.toSi };
}

export type ProfileFields = Omit<InstrumentProfile, 'id' | 'createdAt' | 'updatedAt' | 'demo'>;

/** Validate a whole draft. Either the SI fields of a profile, or one message per bad field. */
export function validateDraft(d: ProfileDraft): { ok: true; fields: ProfileFields } | { ok: false; errors: ProfileErrors } {
  const errors: ProfileErrors = {};
  const name = d.name.trim();
  if (name === '') errors.name = `Name is empty: enter 1 to ${NAME_MAX} characters.`;
  else if (name.length > NAME_MAX) errors.name = `Name is ${name.length} characters long: use 1 to ${NAME_MAX}.`;
  if (!instrumentKinds.some((k) => k.value === d.kind)) {
    errors.kind = `Instrument type “${d.kind}” is not one of: ${instrumentKinds.map((k) => k.label).join('; ')}.`;
  }
  if (!amplitudeForms.some((k) => k.value === d.amplitude)) {
    errors.amplitude = `Amplitude form “${d.amplitude}” is not one of: zero-to-peak, peak-to-peak, rms.`;
  }
  if (!amplitudeReferences.some((k) => k.value === d.reference)) {
    errors.reference = `Amplitude reference “${d.reference}” is not one of: one rod to ground, between the rod pairs.`;
  }
  if (d.notes.length > NOTES_MAX) errors.notes = `Notes are ${d.notes.length} characters long: keep them to ${NOTES_MAX}.`;
  const si: Partial<Record<NumericFieldSpec['key'], number>> = {};
  for (const spec of numericFields) {
    const r = checkNumericField(spec, d[spec.key]);
    if ('error' in r) errors[spec.key] = r.error;
    else si[spec.key] = r.value;
  }
  if (Object.keys(errors).length > 0) return { ok: false, errors };
  return {
    ok: true,
    fields: {
      name,
      kind: d.kind as InstrumentKind,
      rodFieldRadius: si.rodFieldRadius!,
      rodLength: si.rodLength!,
      rfFrequency: si.rfFrequency!,
      maxRfAmplitude: si.maxRfAmplitude!,
      axialEnergy: si.axialEnergy!,
      readbackConvention: { amplitude: d.amplitude as AmplitudeForm, reference: d.reference as AmplitudeReference },
      notes: d.notes,
    },
  };
}

/**
 * Check a stored or imported profile record (SI units). Returns one sentence per problem, naming the field.
 * Shares its ranges with the form so the two can never disagree.
 */
export function profileRecordProblems(p: unknown): string[] {
  const out: string[] = [];
  if (typeof p !== 'object' || p === null) return ['instrument profile is not an object'];
  const r = p as Record<string, unknown>;
  if (typeof r.id !== 'string' || r.id === '') out.push('id must be a non-empty string');
  if (typeof r.name !== 'string' || r.name.trim() === '' || r.name.length > NAME_MAX) out.push(`name must be 1 to ${NAME_MAX} characters`);
  if (!instrumentKinds.some((k) => k.value === r.kind)) out.push(`kind must be one of ${instrumentKinds.map((k) => k.value).join(', ')}`);
  for (const spec of numericFields) {
    const v = r[spec.key];
    const lo = spec.min * spec.toSi;
    const hi = spec.max * spec.toSi;
    // Allow for float rounding of display → SI conversions at the range ends.
    if (typeof v !== 'number' || !Number.isFinite(v) || v < lo * (1 - 1e-12) || v > hi * (1 + 1e-12)) {
      out.push(`${spec.key} must be a number from ${lo} to ${hi} (SI units)`);
    }
  }
  const c = r.readbackConvention as Record<string, unknown> | undefined;
  if (typeof c !== 'object' || c === null || !amplitudeForms.some((k) => k.value === c.amplitude) ||
      !amplitudeReferences.some((k) => k.value === c.reference)) {
    out.push('readbackConvention must be {amplitude: zero-to-peak|peak-to-peak|rms, reference: per-rod|between-pairs}');
  }
  if (typeof r.notes !== 'string' || r.notes.length > NOTES_MAX) out.push(`notes must be a string of at most ${NOTES_MAX} characters`);
  if (typeof r.createdAt !== 'string' || typeof r.updatedAt !== 'string') out.push('createdAt and updatedAt must be ISO date strings');
  return out;
}
