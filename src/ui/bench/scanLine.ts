// The scan line a screen works on, built by the engine from the user's choice: through the apex, constant
// peak width Δm (U = λV − δ with λ at the apex ratio) or constant resolution (U = λV).
import {
  apexRatio, constantResolutionScanLine, constantWidthScanLine, dcForMass, rfForMass, scanPoint, type ScanLine,
} from '../../engine';
import type { InstrumentProfile } from '../../store';
import { tryEngine, type FieldErrors } from './engineErrors';
import { parseNumber } from './inputs';

export type ScanMode = 'apex' | 'constant-width' | 'constant-resolution';

export const scanModes: readonly { value: ScanMode; label: string }[] = [
  { value: 'apex', label: 'Through the apex (zero width)' },
  { value: 'constant-width', label: 'Constant peak width Δm: U = λ·V − δ' },
  { value: 'constant-resolution', label: 'Constant resolution m/Δm: U = λ·V' },
];

export interface ScanLineInputs {
  mode: string;
  width: string;
  referenceMz: string;
  resolution: string;
}

export interface BuiltLine {
  mode: ScanMode;
  /** null for the apex mode (the engine's apex voltages are used directly). */
  line: ScanLine | null;
  description: string;
}

/** Build the scan line; problems go into `errors` under 'width', 'referenceMz', 'resolution' or 'profile'. */
export function buildScanLine(inputs: ScanLineInputs, profile: InstrumentProfile, errors: FieldErrors): BuiltLine | null {
  const mode = (scanModes.some((m) => m.value === inputs.mode) ? inputs.mode : 'apex') as ScanMode;
  const r0 = profile.rodFieldRadius;
  const frequency = profile.rfFrequency;
  if (mode === 'apex') return { mode, line: null, description: `through the apex, U/V = ${apexRatio().toFixed(5)}` };
  if (mode === 'constant-resolution') {
    const r = parseNumber(inputs.resolution, 'Resolution m/Δm', '500');
    if (!r.ok) {
      errors.resolution = r.message;
      return null;
    }
    const line = tryEngine(() => constantResolutionScanLine(r.value), { resolution: 'resolution' }, errors, 'resolution');
    return line && { mode, line, description: `constant resolution ${r.value}: U = ${line.slope.toFixed(6)}·V` };
  }
  const w = parseNumber(inputs.width, 'Peak width Δm', '1');
  const ref = parseNumber(inputs.referenceMz, 'Reference m/z', '219');
  if (!w.ok) errors.width = w.message;
  if (!ref.ok) errors.referenceMz = ref.message;
  if (!w.ok || !ref.ok) return null;
  const line = tryEngine(
    () => constantWidthScanLine({ width: w.value, referenceMz: ref.value, r0, frequency }),
    { width: 'width', referenceMz: 'referenceMz', r0: 'profile', frequency: 'profile' },
    errors,
    'width',
  );
  return line && { mode, line, description: `constant width ${w.value} u (set at m/z ${ref.value}): U = ${line.slope.toFixed(5)}·V − ${line.offset.toPrecision(4)} V` };
}

export interface Expected {
  mz: number;
  /** V zero-to-peak per rod. */
  rf: number;
  /** U per rod to ground. */
  dc: number;
  /** Ideal pass band on this line (null through the apex: zero width). */
  band: { low: number; high: number; width: number; resolution: number } | null;
}

/** Expected U, V for m/z on the line; null with a reason when the line passes nothing there. */
export function expectedFor(mz: number, built: BuiltLine, profile: InstrumentProfile, errors: FieldErrors, field = 'mz'): Expected | { mz: number; reason: string } | null {
  const r0 = profile.rodFieldRadius;
  const frequency = profile.rfFrequency;
  const map = { mz: field, r0: 'profile', frequency: 'profile' };
  if (!built.line) {
    const rf = tryEngine(() => rfForMass({ mz, r0, frequency }), map, errors, field);
    const dc = tryEngine(() => dcForMass({ mz, r0, frequency }), map, errors, field);
    return rf === null || dc === null ? null : { mz, rf, dc, band: null };
  }
  const line = built.line;
  const point = tryEngine(() => scanPoint({ line, mz, r0, frequency }), map, errors, field);
  if (point === null) {
    if (errors[field]) return null;
    return { mz, reason: built.mode === 'constant-width' ? 'no band on this line here: the width is too large for this m/z' : 'no band on this line here' };
  }
  return { mz, rf: point.rf, dc: point.dc, band: { low: point.low, high: point.high, width: point.width, resolution: point.resolution } };
}
