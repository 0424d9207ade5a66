// Proportionality check without geometry (V ∝ m/z at fixed f and r0; Dawson 1976): two or three read-backs at parked m/z values give
// the instrument constant V/m and the deviation from a straight line through the origin.
import { convertRf, hazardousLive, proportionalityCheck, rfForMass, type ProportionalityReading } from '../../engine';
import { HvCaution } from './HvCaution';
import type { InstrumentProfile } from '../../store';
import { NumberField } from '../components/Field';
import { formatNumber } from '../format';
import { rfFormOf, rfFormUnit, rfFormWords } from './conventions';
import { tryEngine, type FieldErrors } from './engineErrors';
import { parseNumber } from './inputs';
import { Result } from './NoteButton';
import type { BenchInputs } from './Voltages';

const rowsOf = [1, 2, 3] as const;

export function Proportionality(props: { inputs: BenchInputs; update: (p: Partial<BenchInputs>) => void; profile: InstrumentProfile }) {
  const { inputs, update, profile } = props;
  const errors: FieldErrors = {};
  const readings: ProportionalityReading[] = [];
  const fieldOfIndex: string[] = [];
  for (const i of rowsOf) {
    const mzText = inputs[`p${i}mz`];
    const rfText = inputs[`p${i}rf`];
    if (rfText.trim() === '') continue;
    const mz = parseNumber(mzText, `Reading ${i} m/z`, '69');
    const rf = parseNumber(rfText, `Reading ${i} RF`, '100.9');
    if (!mz.ok) errors[`p${i}mz`] = mz.message;
    if (!rf.ok) errors[`p${i}rf`] = rf.message;
    if (mz.ok && rf.ok) {
      readings.push({ mz: mz.value, rf: rf.value });
      fieldOfIndex.push(`p${i}`);
    }
  }
  const map: Record<string, string> = {};
  fieldOfIndex.forEach((f, idx) => {
    map[`readings[${idx}].mz`] = `${f}mz`;
    map[`readings[${idx}].rf`] = `${f}rf`;
  });
  const enough = readings.length >= 2 && Object.keys(errors).length === 0;
  const result = enough ? tryEngine(() => proportionalityCheck(readings), map, errors, 'p2mz') : null;
  const form = rfFormOf(profile.readbackConvention);
  const unit = rfFormUnit[form];
  // Read-backs of this size mean the rods carry them: the caution goes with the readings too.
  const hazardous = readings.some((r) => {
    const perRod = tryEngine(() => convertRf(r.rf, form, 'zeroToPeakPerRod'), {}, {}, 'ignored');
    return perRod !== null && hazardousLive({ rf: perRod }).hazardous;
  });
  const expectedK = convertRf(rfForMass({ mz: 1, r0: profile.rodFieldRadius, frequency: profile.rfFrequency }), 'zeroToPeakPerRod', form);

  return (
    <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="prop-title">
      <h2 class="card-title" id="prop-title">Proportionality check (no geometry needed)</h2>
      <p class="hint">Park the filter at two or three m/z values and type the RF read-backs, all in one convention (here: {rfFormWords[form]}). At fixed frequency and field radius, V grows in proportion to m/z; a deviation beyond about ±1 % deserves a look (common practice).</p>
      {rowsOf.map((i) => (
        <div class="pair" key={i} role="group" aria-label={`Reading ${i}`}>
          <NumberField id={`prop-mz-${i}`} label={`Reading ${i}: m/z`} unit="u" value={inputs[`p${i}mz`]} error={errors[`p${i}mz`]} onInput={(t) => update({ [`p${i}mz`]: t } as Partial<BenchInputs>)} />
          <NumberField id={`prop-rf-${i}`} label={`Reading ${i}: RF`} unit={unit} value={inputs[`p${i}rf`]} error={errors[`p${i}rf`]} onInput={(t) => update({ [`p${i}rf`]: t } as Partial<BenchInputs>)} />
        </div>
      ))}
      {!result && readings.length < 2 && <p class="hint">Two read-backs or more give the result.</p>}
      {result && (
        <div data-testid="proportionality-result">
          <p class="big">
            <span class={result.withinTolerance ? 'verdict verdict-pass' : 'verdict verdict-fail'}>
              {result.withinTolerance ? '✓ proportional within ±1 %' : '✗ beyond ±1 %: deserves a look'}
            </span>
          </p>
          <Result label="Instrument constant V/m (fit through the origin)" value={`${formatNumber(result.constant, 5)} ${unit} per u`} testId="prop-constant"
            note={{ label: 'Instrument constant V/m from read-backs', value: result.constant, unit: `${unit}/u`, origin: 'calculator', context: { readings: readings.map((r) => `${r.mz}:${r.rf}`).join(' ') } }} />
          {result.perReading.map((r, idx) => (
            <Result key={idx} label={`Deviation at m/z ${formatNumber(r.mz, 6)}`} value={`${r.deviation >= 0 ? '+' : ''}${formatNumber(r.deviation * 100, 3)} %`}
              note={{ label: `Deviation from proportionality at m/z ${formatNumber(r.mz, 6)}`, value: r.deviation * 100, unit: '%', origin: 'calculator', context: { mz: r.mz, rf: r.rf } }} />
          ))}
          {result.line && (
            <Result label="Straight-line fit: offset at m/z 0" value={`${formatNumber(result.line.intercept, 4)} ${unit} (slope ${formatNumber(result.line.slope, 5)} ${unit} per u)`}
              note={{ label: 'RF offset at m/z 0 from a straight-line fit of read-backs', value: result.line.intercept, unit, origin: 'calculator' }} />
          )}
          <Result label="For comparison: V/m from this profile's geometry on the apex line" value={`${formatNumber(expectedK, 5)} ${unit} per u`}
            note={{ label: 'Expected V/m from profile geometry (apex line)', value: expectedK, unit: `${unit}/u`, origin: 'calculator' }} />
        </div>
      )}
      {hazardous && <HvCaution compact />}
    </form>
  );
}
