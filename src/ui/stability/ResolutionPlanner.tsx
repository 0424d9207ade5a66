// Resolution planner: forward (U/V, rods, frequency, ion energy, m/z → ideal resolution exact and by the apex
// rule, RF cycles, the n²/K limit, the largest ion energy for a wanted Δm), reverse (target m/Δm → U/V, U
// and V), the two scan laws across the mass range, and scan planning (time and S/N gain).
import {
  APEX_RULE, apexRatio, CYCLE_LIMIT_CONSTANTS, constantResolutionScanLine, cycleLimitedResolution, massRangeTop,
  maxAxialEnergy, ratioForResolution, resolutionAtRatio, scanPoint, type CycleLimitChoice,
} from '../../engine';
import type { InstrumentProfile } from '../../store';
import { NumberField, SelectField } from '../components/Field';
import { InputsFold, More } from '../components/Fold';
import { InstrumentLine } from '../components/InstrumentLine';
import { useApp } from '../context';
import { formatNumber, formatSi } from '../format';
import { rfAs, rfFormOf, rfFormUnit, rfFormUnitId } from '../bench/conventions';
import { tryEngine, type FieldErrors } from '../bench/engineErrors';
import { parseNumber, usePersistentInputs } from '../bench/inputs';
import { Result } from '../bench/NoteButton';
import { HvCaution, isHazardousLive } from '../bench/HvCaution';
import { ScanLawChart } from './ScanLawChart';
import { ScanPlanning } from './ScanPlanning';
import { TransmissionCost } from './TransmissionCost';
import { DraftProblem } from '../components/DraftProblem';
import { NeedInstrument } from '../components/NeedInstrument';

type PlannerInputs = {
  ratio: string; mz: string; rodLength: string; frequency: string; axialEnergy: string; k: string; wantedWidth: string; targetR: string;
};

function plannerDefaults(p: InstrumentProfile | null): PlannerInputs {
  return {
    ratio: '0.1675', mz: p?.kind === 'rga' ? '28' : '219',
    rodLength: p ? String(+(p.rodLength * 1e3).toPrecision(6)) : '150',
    frequency: p ? String(+(p.rfFrequency / 1e6).toPrecision(6)) : '1',
    axialEnergy: p ? String(p.axialEnergy) : '5', k: 'paul1958', wantedWidth: '1', targetR: '1000',
  };
}

const kChoices = Object.entries(CYCLE_LIMIT_CONSTANTS).map(([key, v]) => ({ value: key as CycleLimitChoice, label: `K = ${v.value} (${v.source})` }));

export function ResolutionPlanner() {
  const { instrument } = useApp();
  const [inputs, update, inputsProblem] = usePersistentInputs<PlannerInputs>('resolution', plannerDefaults);
  if (!instrument) return <NeedInstrument>Pick or add an instrument first: the planner starts from its rods and RF.</NeedInstrument>;
  const profile = instrument;
  const errors: FieldErrors = {};
  const num = (key: keyof PlannerInputs, label: string, example: string) => {
    const r = parseNumber(inputs[key], label, example);
    if (!r.ok) errors[key] = r.message;
    return r.ok ? r.value : null;
  };
  const ratio = num('ratio', 'U/V', '0.1675');
  const mz = num('mz', 'm/z', '219');
  const rodLengthMm = num('rodLength', 'Rod length', '150');
  const frequencyMHz = num('frequency', 'RF frequency', '1.0');
  const axialEnergy = num('axialEnergy', 'Ion energy', '5');
  const wanted = num('wantedWidth', 'Wanted Δm', '1');
  const target = num('targetR', 'Target m/Δm', '1000');
  const k = (inputs.k in CYCLE_LIMIT_CONSTANTS ? inputs.k : 'paul1958') as CycleLimitChoice;
  const rodLength = rodLengthMm === null ? null : rodLengthMm / 1e3;
  const frequency = frequencyMHz === null ? null : frequencyMHz * 1e6;

  const atRatio = ratio === null ? null : tryEngine(() => resolutionAtRatio(ratio), { ratio: 'ratio' }, errors, 'ratio');
  const cycles = mz !== null && rodLength !== null && frequency !== null && axialEnergy !== null
    ? tryEngine(() => cycleLimitedResolution({ mz, rodLength, frequency, axialEnergy, k }), { mz: 'mz', rodLength: 'rodLength', frequency: 'frequency', axialEnergy: 'axialEnergy' }, errors, 'mz')
    : null;
  const energy = wanted !== null && rodLength !== null && frequency !== null
    ? tryEngine(() => maxAxialEnergy({ width: wanted, rodLength, frequency, k }), { width: 'wantedWidth', rodLength: 'rodLength', frequency: 'frequency' }, errors, 'wantedWidth')
    : null;
  const reverse = target !== null ? tryEngine(() => ratioForResolution(target), { resolution: 'targetR' }, errors, 'targetR') : null;
  const reversePoint = target !== null && mz !== null && reverse && frequency !== null
    ? tryEngine(() => scanPoint({ line: constantResolutionScanLine(target), mz, r0: profile.rodFieldRadius, frequency }), { mz: 'mz', resolution: 'targetR', frequency: 'frequency' }, errors, 'targetR')
    : null;
  const form = rfFormOf(profile.readbackConvention);
  const ctx = { ratio: inputs.ratio.trim(), mz: inputs.mz.trim(), rodLengthMm: inputs.rodLength.trim(), frequencyMHz: inputs.frequency.trim(), axialEnergyEv: inputs.axialEnergy.trim() };
  const top = frequency !== null ? tryEngine(() => massRangeTop({ maxRf: profile.maxRfAmplitude, r0: profile.rodFieldRadius, frequency }), { frequency: 'frequency' }, errors, 'frequency') : null;

  const inputsInvalid = !!(errors.ratio || errors.mz || errors.rodLength || errors.frequency || errors.axialEnergy || errors.wantedWidth);

  return (
    <>
      <InstrumentLine profile={profile} rods />
      <DraftProblem problem={inputsProblem} />
      <InputsFold id="res-inputs-fold" testId="resolution-fold" invalid={inputsInvalid}
        summary={`U/V ${inputs.ratio.trim() || '—'} · m/z ${inputs.mz.trim() || '—'} · rods ${inputs.rodLength.trim() || '—'} mm · ${inputs.frequency.trim() || '—'} MHz · ${inputs.axialEnergy.trim() || '—'} eV · Δm ${inputs.wantedWidth.trim() || '—'} u`}>
        <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="res-fwd">
          <h2 class="card-title" id="res-fwd">Resolution at a setting</h2>
          <div class="pair">
            <NumberField id="res-ratio" label="U/V" value={inputs.ratio} error={errors.ratio} onInput={(t) => update({ ratio: t })} hint={`apex ${apexRatio().toFixed(5)}`} />
            <NumberField id="res-mz" label="m/z" unit="u" value={inputs.mz} error={errors.mz} onInput={(t) => update({ mz: t })} />
            <NumberField id="res-length" label="Rod length" unit="mm" value={inputs.rodLength} error={errors.rodLength} onInput={(t) => update({ rodLength: t })} />
            <NumberField id="res-freq" label="RF frequency" unit="MHz" value={inputs.frequency} error={errors.frequency} onInput={(t) => update({ frequency: t })} />
            <NumberField id="res-energy" label="Ion energy" unit="eV" value={inputs.axialEnergy} error={errors.axialEnergy} onInput={(t) => update({ axialEnergy: t })} />
            <NumberField id="res-wanted" label="Wanted Δm" unit="u" value={inputs.wantedWidth} error={errors.wantedWidth} onInput={(t) => update({ wantedWidth: t })} />
          </div>
          <SelectField id="res-k" label="Cycle-limit constant K" value={k} options={kChoices} onChange={(v) => update({ k: v })} />
        </form>
      </InputsFold>

      <div class="card" data-testid="resolution-forward">
        <h2 class="card-title">Ideal field and RF-cycle limits</h2>
        {atRatio && (
          <>
            <Result label="m/Δm from the region's edges (exact, ideal field)" testId="res-exact"
              value={atRatio.exact === null ? 'none: U/V at or above the apex, nothing passes' : `${formatNumber(atRatio.exact, 4)}${mz !== null ? ` (Δm ${formatNumber(mz / atRatio.exact, 3)} u at m/z ${formatNumber(mz, 6)})` : ''}`}
              note={atRatio.exact === null ? null : { label: 'Ideal resolution from the region edges', value: atRatio.exact, unit: '', origin: 'calculator', context: ctx }} />
            <Result label={`m/Δm by the rule ${APEX_RULE.numerator}/(${APEX_RULE.apexRatio} − U/V) (Dawson 1976, from memory)`} testId="res-rule"
              value={atRatio.rule === null ? `none: U/V at or above ${APEX_RULE.apexRatio}` : formatNumber(atRatio.rule, 4)}
              note={atRatio.rule === null ? null : { label: 'Resolution by the apex rule', value: atRatio.rule, unit: '', origin: 'calculator', context: ctx }} />
          </>
        )}
        {cycles && (
          <>
            <Result label="RF cycles in the rods, n" value={formatNumber(cycles.cycles, 4)} testId="res-cycles"
              note={{ label: 'RF cycles an ion spends in the rods', value: cycles.cycles, unit: '', origin: 'calculator', context: ctx }} />
            <Result label={`Cycle limit n²/K with K = ${cycles.k}`} value={`m/Δm ≤ ${formatNumber(cycles.resolution, 4)}`} testId="res-cycle-limit" hint={cycles.kSource}
              note={{ label: `Cycle-limited resolution n²/K (K = ${cycles.k})`, value: cycles.resolution, unit: '', origin: 'calculator', context: { ...ctx, k: cycles.k } }} />
            {atRatio?.exact != null && (
              <p class="hint" data-testid="res-limiting">
                {cycles.resolution < atRatio.exact
                  ? `The RF cycles limit this setting: expect about m/Δm ${formatNumber(cycles.resolution, 3)}, not the ideal ${formatNumber(atRatio.exact, 3)}. Lower the ion energy or use longer rods or a higher frequency.`
                  : `The U/V setting limits this setting (m/Δm ${formatNumber(atRatio.exact, 3)}); the RF cycles allow up to ${formatNumber(cycles.resolution, 3)}.`}
              </p>
            )}
          </>
        )}
        {energy && wanted !== null && (
          <Result label={`Largest ion energy for Δm = ${formatNumber(wanted, 4)} u (K = ${energy.k})`} value={formatSi(energy.axialEnergy, 'eV', 3)} testId="res-max-energy"
            note={{ label: `Largest ion energy for Δm ${wanted} u`, value: energy.axialEnergy, unit: 'eV', origin: 'calculator', context: { ...ctx, k: energy.k } }} />
        )}
      </div>

      <More title="Setting for a target resolution" class="more-tool" testId="reverse-fold"><form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="res-rev">
        <h2 class="card-title" id="res-rev">Setting for a target resolution</h2>
        <NumberField id="res-target" label="Target m/Δm" value={inputs.targetR} error={errors.targetR} onInput={(t) => update({ targetR: t })} />
        {reverse && (
          <div data-testid="resolution-reverse">
            <Result label="U/V (exact, from the edges)" value={formatNumber(reverse.exact, 7)} testId="rev-exact"
              note={{ label: `U/V for m/Δm ${inputs.targetR.trim()} (exact)`, value: reverse.exact, unit: '', origin: 'calculator' }} />
            <Result label="U/V by the rule 0.16784 − 0.126/R" value={formatNumber(reverse.rule, 7)} testId="rev-rule"
              note={{ label: `U/V for m/Δm ${inputs.targetR.trim()} (apex rule)`, value: reverse.rule, unit: '', origin: 'calculator' }} />
            {reversePoint && mz !== null && rfAs(form, reversePoint.rf) !== null && (
              <>
                <Result label={`V at m/z ${formatNumber(mz, 6)} (read-back form)`} value={`${formatNumber(rfAs(form, reversePoint.rf)!, 5)} ${rfFormUnit[form]}`}
                  note={{ label: `RF for m/Δm ${inputs.targetR.trim()} at m/z ${mz}`, value: rfAs(form, reversePoint.rf)!, unit: rfFormUnitId[form], origin: 'calculator', context: { mz }, typeId: 'rf-amplitude' }} />
                <Result label={`U at m/z ${formatNumber(mz, 6)}, one rod to ground`} value={formatSi(reversePoint.dc, 'V', 5)}
                  note={{ label: `DC for m/Δm ${inputs.targetR.trim()} at m/z ${mz}`, value: reversePoint.dc, unit: 'V-rod', origin: 'calculator', context: { mz }, typeId: 'dc-amplitude' }} />
              </>
            )}
            {reversePoint && isHazardousLive(reversePoint.dc, reversePoint.rf) && <HvCaution compact />}
            {cycles && target !== null && target > cycles.resolution && (
              <p class="notice">m/Δm {formatNumber(target, 4)} is above the RF-cycle limit n²/K ≈ {formatNumber(cycles.resolution, 4)} for these ions: the band will not close that far in practice.</p>
            )}
          </div>
        )}
        {reversePoint && mz !== null && target !== null && rodLength !== null && frequency !== null && axialEnergy !== null && (
          <TransmissionCost mz={mz} dc={reversePoint.dc} rf={reversePoint.rf} r0={profile.rodFieldRadius} frequency={frequency} rodLength={rodLength} axialEnergy={axialEnergy} targetR={target} />
        )}
      </form></More>

      {top !== null && <More title="The two scan laws across the mass range" class="more-tool"><ScanLawChart profile={profile} top={top} /></More>}
      <More title="Scan planning: time per scan and S/N" class="more-tool"><ScanPlanning /></More>
    </>
  );
}
