// Inverse: a measured RF amplitude in its convention → the m/z it passes on the current scan line, and the
// mass error against the set m/z.
import { convertRf, hazardousLive, massError, massForRf, massForScanRf, rfForMass, rfFormOf } from '../../engine';
import { factorWords, rfConventionSuspects } from '../../records';
import { ConventionChoice, useProbeConvention } from '../components/ConventionChoice';
import type { InstrumentProfile } from '../../store';
import { NumberField } from '../components/Field';
import { formatNumber, formatSi } from '../format';
import { rfFormUnitId, rfFormWords } from './conventions';
import { tryEngine, type FieldErrors } from './engineErrors';
import { HvCaution } from './HvCaution';
import { parseNumber } from './inputs';
import { Result } from './NoteButton';
import type { BuiltLine } from './scanLine';
import type { BenchInputs } from './Voltages';

export function InverseCheck(props: { inputs: BenchInputs; update: (p: Partial<BenchInputs>) => void; built: BuiltLine | null; profile: InstrumentProfile }) {
  const { inputs, update, built, profile } = props;
  const errors: FieldErrors = {};
  // How the RF was read at the probe: one tap, remembered per instrument, defaulting to its read-back.
  const readback = rfFormOf(profile.readbackConvention);
  const [form, setForm] = useProbeConvention(profile.id, readback);
  const typed = inputs.invRf.trim() !== '';
  const rfIn = typed ? parseNumber(inputs.invRf, 'Measured RF', '734') : null;
  const setIn = parseNumber(inputs.invSetMz, 'Set m/z', '502');
  if (rfIn && !rfIn.ok) errors.invRf = rfIn.message;
  if (!setIn.ok) errors.invSetMz = setIn.message;
  let passed: number | null = null;
  let perRod: number | null = null;
  let err: { error: number; ppm: number } | null = null;
  if (rfIn?.ok && built) {
    perRod = tryEngine(() => convertRf(rfIn.value, form, 'zeroToPeakPerRod'), { value: 'invRf' }, errors, 'invRf');
    if (perRod !== null) {
      const r0 = profile.rodFieldRadius;
      const frequency = profile.rfFrequency;
      const map = { rf: 'invRf', r0: 'profile', frequency: 'profile' };
      const v = perRod;
      passed = built.line
        ? tryEngine(() => massForScanRf({ line: built.line!, rf: v, r0, frequency }), map, errors, 'invRf')
        : tryEngine(() => massForRf({ rf: v, r0, frequency }), map, errors, 'invRf');
      if (passed === null && !errors.invRf) errors.invRf = 'At this amplitude the scan line passes no m/z (the DC offset exceeds λ·V). Check the value and its convention.';
    }
  }
  if (passed !== null && setIn.ok) err = tryEngine(() => massError({ setMz: setIn.value, passedMz: passed! }), { setMz: 'invSetMz', passedMz: 'invRf' }, errors, 'invSetMz');
  // Expected RF at the set m/z (first-region apex, Dawson 1976), in the convention chosen.
  const expectedV0p = setIn.ok ? tryEngine(() => rfForMass({ mz: setIn.value, r0: profile.rodFieldRadius, frequency: profile.rfFrequency }), { mz: 'invSetMz' }, errors, 'invSetMz') : null;
  const expectedShown = expectedV0p !== null ? tryEngine(() => convertRf(expectedV0p, 'zeroToPeakPerRod', form), { value: 'invSetMz' }, errors, 'invSetMz') : null;
  // A mass error the size of a convention factor (2, √2, 2√2, 4): say which convention would put the m/z right.
  // Within 0.5 u or 0.1 % of the set m/z counts as right (half a unit-resolution peak; common practice).
  const near = (m: number) => setIn.ok && Math.abs(m - setIn.value) <= Math.max(0.5, 1e-3 * setIn.value);
  const suspect = err && rfIn?.ok && setIn.ok && passed !== null && !near(passed)
    ? rfConventionSuspects(rfIn.value, form, (v) => {
        try {
          const v0p = convertRf(v, form, 'zeroToPeakPerRod');
          const m = built?.line ? massForScanRf({ line: built.line, rf: v0p, r0: profile.rodFieldRadius, frequency: profile.rfFrequency }) : massForRf({ rf: v0p, r0: profile.rodFieldRadius, frequency: profile.rfFrequency });
          return m !== null && near(m);
        } catch {
          return false;
        }
      })[0]
    : undefined;
  const hazard = perRod !== null ? hazardousLive({ rf: perRod }) : null;
  const ctx: Record<string, string | number> = { convention: rfFormWords[form], measured: inputs.invRf.trim() };
  if (setIn.ok) ctx.mz = setIn.value;

  return (
    <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="inverse-title">
      <h2 class="card-title" id="inverse-title">Which m/z does a measured RF pass?</h2>
      <NumberField id="inv-rf" label="Measured RF amplitude" unit="V" value={inputs.invRf} error={errors.invRf} onInput={(t) => update({ invRf: t })} />
      <ConventionChoice id="inv-convention" value={form} readback={readback} onChange={(f) => { setForm(f); update({ invForm: f }); }} />
      <NumberField id="inv-set" label="Set m/z" unit="u" value={inputs.invSetMz} error={errors.invSetMz} onInput={(t) => update({ invSetMz: t })} />
      {expectedShown !== null && (
        <div class="expect-box" data-testid="inverse-expected">
          <p class="expect-big">Expected at m/z {inputs.invSetMz.trim()}: {formatNumber(expectedShown, 4)} V</p>
          <p class="big">{rfFormWords[form]}</p>
          <p class="hint">At the first-region apex for this profile’s r0 and f (Dawson 1976); the operating point sits a little below it.</p>
        </div>
      )}
      {suspect && (
        <p class="notice" data-testid="inverse-convention">
          <span class="verdict verdict-convention">⇄ check the convention</span> The m/z is off by about a factor of {factorWords(Math.max(suspect.factor, 1 / suspect.factor))} in
          RF, the size of a convention slip: read as {rfFormWords[suspect.form]}, this reading would pass the set m/z. Check how it was taken before
          looking for a fault.
        </p>
      )}
      {!typed && <p class="hint">Enter a read-back or a probe reading to see the m/z it passes on the scan line above.</p>}
      {perRod !== null && rfIn?.ok && (
        <Result label={`Measured RF (${rfFormWords[form]})`} value={`${formatNumber(rfIn.value, 6)} V`}
          note={{ label: `Measured RF at set m/z ${inputs.invSetMz.trim()} (${rfFormWords[form]})`, value: rfIn.value, unit: rfFormUnitId[form], origin: 'entered', context: ctx, typeId: 'rf-amplitude' }} />
      )}
      {perRod !== null && (
        <Result label="Same amplitude, zero-to-peak, one rod to ground" value={formatSi(perRod, 'V 0-p', 5)}
          hint={perRod > profile.maxRfAmplitude ? `Above the supply's largest RF in this profile (${formatSi(profile.maxRfAmplitude, 'V 0-p')}).` : undefined}
          note={{ label: 'Measured RF as zero-to-peak, one rod to ground', value: perRod, unit: 'V0p-rod', origin: 'entered', context: ctx, typeId: 'rf-amplitude' }} />
      )}
      {passed !== null && (
        <Result label="m/z passed (band centre on this scan line)" value={`m/z ${formatNumber(passed, 6)}`} testId="inverse-mz"
          note={{ label: 'm/z passed at the measured RF', value: passed, unit: 'u', origin: 'calculator', context: ctx }} />
      )}
      {err && (
        <>
          <Result label={`Mass error against m/z ${inputs.invSetMz.trim()}`} value={`${err.error >= 0 ? '+' : ''}${formatNumber(err.error, 4)} u`} testId="inverse-error-u"
            note={{ label: `Mass error against set m/z ${inputs.invSetMz.trim()}`, value: err.error, unit: 'u', origin: 'calculator', context: ctx }} />
          <Result label="Mass error, relative" value={`${err.ppm >= 0 ? '+' : ''}${formatNumber(err.ppm, 4)} ppm`} testId="inverse-error-ppm"
            note={{ label: `Relative mass error against set m/z ${inputs.invSetMz.trim()}`, value: err.ppm, unit: 'ppm', origin: 'calculator', context: ctx }} />
        </>
      )}
      {hazard?.hazardous && <HvCaution exceeded={hazard.exceeded} />}
    </form>
  );
}
