// Vacuum check: an ion-gauge reading (N2-equivalent) with its unit and the gas → true pressure, mean free
// path against rod length, the unscattered fraction exp(−L/λ) and a plain verdict.
import {
  convertPressure, GAS_NAMES, GAS_PRESETS, GAUGE_GASES, ION_GAUGE_SENSITIVITY, ION_GAUGE_SOURCE, ionGaugeTruePressure,
  PRESSURE_UNITS, scatteringAlongRods, type GasName, type GaugeGas, type PressureUnit,
} from '../../engine';
import type { InstrumentProfile } from '../../store';
import { NumberField, SelectField } from '../components/Field';
import { useApp } from '../context';
import { formatNumber, formatSi } from '../format';
import { tryEngine, type FieldErrors } from './engineErrors';
import { parseNumber, usePersistentInputs } from './inputs';
import { Result } from './NoteButton';
import { DraftProblem } from '../components/DraftProblem';

// Default gas: helium carrier on GC-MS; nitrogen (air) on LC-MS and RGAs, the usual background there (common practice).
type VacuumInputs = { reading: string; unit: string; gas: string; temperature: string; rodLength: string };

function vacuumDefaults(p: InstrumentProfile | null): VacuumInputs {
  return { reading: p?.kind === 'rga' ? '2e-7' : '1.5e-5', unit: 'mbar', gas: p && (p.kind === 'rga' || p.kind.startsWith('lc-ms')) ? 'N2' : 'He', temperature: '20', rodLength: p ? String(+(p.rodLength * 1e3).toPrecision(6)) : '150' };
}

type Verdict = { cls: 'pass' | 'borderline' | 'fail'; symbol: string; words: string };

/**
 * Our own plain reading of the scattering loss over the rods (common practice, no published limit): at least
 * 90 % unscattered is fine, 70–90 % costs signal noticeably, below 70 % the analyser is starved.
 */
function verdictOf(unscattered: number): Verdict {
  if (unscattered >= 0.9) return { cls: 'pass', symbol: '✓', words: 'The mean free path is far longer than the rods: little scattering.' };
  if (unscattered >= 0.7) return { cls: 'borderline', symbol: '△', words: 'Some ions scatter on the way through; large ions (high m/z) lose first. Look for the gas load.' };
  return { cls: 'fail', symbol: '✗', words: 'Many ions scatter before the detector: find the leak or gas load before judging sensitivity.' };
}

export function VacuumCheck() {
  const { instrument } = useApp();
  const [inputs, update, inputsProblem] = usePersistentInputs<VacuumInputs>('vacuum', vacuumDefaults);
  const errors: FieldErrors = {};
  const unit = ((PRESSURE_UNITS as readonly string[]).includes(inputs.unit) ? inputs.unit : 'mbar') as PressureUnit;
  const gas = ((GAUGE_GASES as readonly string[]).includes(inputs.gas) ? inputs.gas : 'N2') as GaugeGas;
  const reading = parseNumber(inputs.reading, 'Gauge reading', '1.5e-5');
  const temperature = parseNumber(inputs.temperature, 'Gas temperature', '20');
  const rodLength = parseNumber(inputs.rodLength, 'Rod length', '150');
  if (!reading.ok) errors.reading = reading.message;
  if (!temperature.ok) errors.temperature = temperature.message;
  if (!rodLength.ok) errors.rodLength = rodLength.message;
  // Mean free path needs a collision diameter; the engine has a few gases, N2 stands in for the rest.
  const pathGas: GasName = (GAS_NAMES as readonly string[]).includes(gas) ? (gas as GasName) : 'N2';
  let truePressure: number | null = null;
  let truePa: number | null = null;
  let scatter: ReturnType<typeof scatteringAlongRods> | null = null;
  if (reading.ok) {
    truePressure = tryEngine(() => ionGaugeTruePressure({ indicated: reading.value, gas }), { indicated: 'reading', gas: 'gas' }, errors, 'reading');
    if (truePressure !== null) truePa = tryEngine(() => convertPressure(truePressure!, unit, 'Pa'), { value: 'reading' }, errors, 'reading');
  }
  if (truePa !== null && temperature.ok && rodLength.ok) {
    const pa = truePa;
    scatter = tryEngine(
      () => scatteringAlongRods({ gas: pathGas, pressure: pa, temperature: temperature.value + 273.15, rodLength: rodLength.value / 1e3 }),
      { pressure: 'reading', temperature: 'temperature', rodLength: 'rodLength' },
      errors,
      'reading',
    );
  }
  const verdict = scatter ? verdictOf(scatter.unscatteredFraction) : null;
  const otherUnits = PRESSURE_UNITS.filter((u) => u !== unit);
  const ctx = { reading: `${inputs.reading.trim()} ${unit}`, gaugeGas: gas, temperatureC: inputs.temperature.trim() };

  return (
    <>
      <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="vac-title">
        <h2 class="card-title" id="vac-title">Gauge reading</h2>
        <DraftProblem problem={inputsProblem} />
        {instrument && <p class="hint">Rod length starts from the profile of {instrument.name}.</p>}
        <div class="pair">
          <NumberField id="vac-reading" inputMode="text" label="Ion-gauge reading (N2-equivalent)" value={inputs.reading} error={errors.reading} onInput={(t) => update({ reading: t })} hint="e.g. 1.5e-5" />
          <SelectField id="vac-unit" label="Unit" value={unit} options={PRESSURE_UNITS.map((u) => ({ value: u, label: u }))} onChange={(v) => update({ unit: v })} />
        </div>
        <SelectField id="vac-gas" label="Gas in the analyser" value={gas}
          options={GAUGE_GASES.map((g) => ({ value: g, label: `${g} (gauge sensitivity ${ION_GAUGE_SENSITIVITY[g]})` }))} onChange={(v) => update({ gas: v })} />
        <div class="pair">
          <NumberField id="vac-temp" inputMode="text" label="Gas temperature" unit="°C" value={inputs.temperature} error={errors.temperature} onInput={(t) => update({ temperature: t })} />
          <NumberField id="vac-length" label="Rod length" unit="mm" value={inputs.rodLength} error={errors.rodLength} onInput={(t) => update({ rodLength: t })} />
        </div>
        <p class="hint">Hot-cathode gauges read N2-equivalent: true pressure = reading / relative sensitivity ({ION_GAUGE_SOURCE}; gauges differ by up to ±15 %). Pirani gauges follow a different pattern: use the gauge's own curve.</p>
      </form>

      {truePressure !== null && truePa !== null && (
        <div class="card" data-testid="vacuum-result">
          <h2 class="card-title">Result</h2>
          {verdict && (
            <p class="big" data-testid="vacuum-verdict">
              <span class={`verdict verdict-${verdict.cls}`}>{verdict.symbol} {verdict.cls}</span> {verdict.words}
            </p>
          )}
          {reading.ok && (
            <Result label="Gauge reading as entered (N2-equivalent)" value={formatSi(reading.value, unit, 3)}
              note={{ label: 'Analyser ion-gauge reading (N2-equivalent)', value: reading.value, unit, origin: 'entered', context: { gaugeGas: gas }, typeId: 'vacuum-high' }} />
          )}
          <Result label={`True ${gas} pressure`} value={`${formatSi(truePressure, unit, 3)} (${otherUnits.map((u) => formatSi(convertPressure(truePa!, 'Pa', u), u, 3)).join(', ')})`}
            testId="true-pressure" note={{ label: `True ${gas} pressure from ion-gauge reading`, value: truePressure, unit, origin: 'calculator', context: ctx }} />
          {scatter && (
            <>
              <Result label={`Mean free path (${pathGas}${pathGas !== gas ? `, standing in for ${gas}` : ''}, ${GAS_PRESETS[pathGas].diameter * 1e10} Å collision diameter)`}
                value={scatter.meanFreePath >= 1 ? formatSi(scatter.meanFreePath, 'm', 3) : formatSi(scatter.meanFreePath * 100, 'cm', 3)} testId="mean-free-path"
                note={{ label: 'Mean free path in the analyser', value: scatter.meanFreePath, unit: 'm', origin: 'calculator', context: ctx }} />
              <Result label="Mean free path / rod length" value={`${formatNumber(scatter.ratioToRodLength, 3)} ×`}
                note={{ label: 'Mean free path over rod length', value: scatter.ratioToRodLength, unit: '', origin: 'calculator', context: ctx }} />
              <Result label="Unscattered over the rods, exp(−L/λ)" value={`${formatNumber(scatter.unscatteredFraction * 100, 4)} %`} testId="unscattered"
                note={{ label: 'Unscattered fraction over the rods', value: scatter.unscatteredFraction * 100, unit: '%', origin: 'calculator', context: ctx }} />
              <p class="hint">Molecule-in-its-own-gas mean free path (kinetic theory). Ions, larger than the molecules, scatter more: losses show first at high m/z. Common working figure for the analyser: a gauge reading below about 1×10⁻⁵ Torr (common practice). Verdict: ✓ pass at 90 % unscattered or more, △ borderline from 70 to 90 %, ✗ fail below 70 % (our own reading of the numbers).</p>
            </>
          )}
        </div>
      )}
    </>
  );
}
