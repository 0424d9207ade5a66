// Expected U and V for a list of m/z on the chosen scan line, in the read-back convention and every other,
// with the hazardous-live caution, the top of the mass range, the inverse and the proportionality check.
import {
  convertDc, convertRf, DC_FORMS, hazardousLive, massRangeTop, RF_FORMS, type HazardousLiveResult,
} from '../../engine';
import type { InstrumentProfile } from '../../store';
import { NumberField } from '../components/Field';
import { CautionLine, Disclosure, InputsFold, More } from '../components/Fold';
import { InstrumentLine, scanLineSummary } from '../components/InstrumentLine';
import { useApp } from '../context';
import { formatNumber, formatSi } from '../format';
import { ionListsFor, defaultIons } from './calibrants';
import { dcAs, dcFormOf, dcFormUnitId, dcFormWords, rfAs, rfFormOf, rfFormUnit, rfFormUnitId, rfFormWords } from './conventions';
import { tryEngine, type FieldErrors } from './engineErrors';
import { HvCaution } from './HvCaution';
import { listHint, parseMzList, useFromInputs, usePersistentInputs } from './inputs';
import { InverseCheck } from './InverseCheck';
import { Proportionality } from './Proportionality';
import { Result } from './NoteButton';
import { buildScanLine, expectedFor, type BuiltLine, type Expected } from './scanLine';
import { ScanLineFields } from './ScanLineFields';
import { DraftProblem } from '../components/DraftProblem';
import { NeedInstrument } from '../components/NeedInstrument';

export type BenchInputs = {
  mzList: string; mode: string; width: string; referenceMz: string; resolution: string;
  invRf: string; invForm: string; invSetMz: string;
  p1mz: string; p1rf: string; p2mz: string; p2rf: string; p3mz: string; p3rf: string;
};

export function benchDefaults(p: InstrumentProfile | null): BenchInputs {
  const rga = p?.kind === 'rga';
  return {
    mzList: defaultIons(p).join(', '), mode: 'apex', width: '1', referenceMz: rga ? '28' : '219', resolution: rga ? '100' : '500',
    invRf: '', invForm: p ? rfFormOf(p.readbackConvention) : 'zeroToPeakPerRod', invSetMz: rga ? '28' : '69',
    p1mz: rga ? '18' : '69', p1rf: '', p2mz: rga ? '28' : '219', p2rf: '', p3mz: rga ? '44' : '502', p3rf: '',
  };
}

/** The scan line, the expected U and V for each listed m/z, and the top of the mass range, with field messages. */
function expectedModel(inputs: BenchInputs, profile: InstrumentProfile) {
  const errors: FieldErrors = {};
  const list = parseMzList(inputs.mzList);
  if (!list.ok) errors.mz = list.message;
  const built = buildScanLine(inputs, profile, errors);
  const rows = list.ok && built ? list.values.map((mz) => expectedFor(mz, built, profile, errors, 'mz')) : [];
  const top = tryEngine(() => massRangeTop({ maxRf: profile.maxRfAmplitude, r0: profile.rodFieldRadius, frequency: profile.rfFrequency }), { maxRf: 'profile', r0: 'profile', frequency: 'profile' }, errors, 'profile');
  return { errors, list, built, rows, top };
}

export function Voltages() {
  const { instrument } = useApp();
  const [inputs, update, inputsProblem] = usePersistentInputs<BenchInputs>('bench', benchDefaults);
  const model = useFromInputs(inputs, instrument, expectedModel);
  // Keyed, so the notice shown while the database opens is never reused (moved) as a notice of the filled screen.
  if (!instrument || !model) return <NeedInstrument key="no-instrument">Pick or add an instrument first: every expected value comes from its profile.</NeedInstrument>;
  const profile = instrument;
  const { errors, list, built, rows, top } = model;
  const readForm = rfFormOf(profile.readbackConvention);
  const readDc = dcFormOf(profile.readbackConvention);
  // Far beyond any supply (tens of megavolts) there is nothing useful to convert: say so instead.
  const shown = rows.map((r) => (r && 'rf' in r && (rfAs('peakToPeakBetweenPairs', r.rf) === null || dcAs('betweenPairs', r.dc) === null)
    ? { mz: r.mz, reason: 'the voltages for this m/z are tens of megavolts, far beyond any RF supply' } : r));
  const good = shown.filter((r): r is Expected => !!r && 'rf' in r);
  const hazards = good.map((r) => hazardousLive({ dc: r.dc, rf: r.rf }));
  const anyHazard = hazards.some((h) => h.hazardous);
  const exceeded = [...new Set(hazards.flatMap((h) => h.exceeded))];

  const inputsInvalid = !!(errors.mz || errors.width || errors.referenceMz || errors.resolution);

  return (
    <>
      <InstrumentLine profile={profile} />
      <DraftProblem problem={inputsProblem} />
      <InputsFold id="bench-inputs" summary={`m/z ${inputs.mzList.trim() || '—'} · ${scanLineSummary(inputs)}`} invalid={inputsInvalid} testId="bench-fold">
        <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="expected-title">
          <h2 class="card-title" id="expected-title">Expected voltages</h2>
          <NumberField id="bench-mz" inputMode="text" label="m/z (one or a list)" value={inputs.mzList} error={errors.mz} onInput={(t) => update({ mzList: t })}
            hint={<span data-testid="bench-mz-read-as">{listHint(list)}</span>} />
          <div class="row" role="group" aria-label="Ion lists">
            {ionListsFor(profile).map((l) => (
              <button key={l.label} type="button" class="btn btn-small" onClick={() => update({ mzList: l.values.join(', ') })}>{l.label}</button>
            ))}
          </div>
          <ScanLineFields idPrefix="bench" values={inputs} errors={errors} onChange={update} />
          {built && <p class="hint" data-testid="scan-line">Scan line: {built.description}.</p>}
        </form>
      </InputsFold>

      {anyHazard && (
        <CautionLine testId="hv-short" text={<><strong>Hazardous live</strong> rods: monitor point or rated probe only</>}>
          <HvCaution exceeded={exceeded} id="hv-caution" />
        </CautionLine>
      )}

      <ul class="cards" aria-label="Expected voltages per m/z" data-testid="expected-list">
        {shown.map((r, i) => r === null ? null : 'reason' in r ? (
          <li key={i} class="card"><h3 class="card-title">m/z {formatNumber(r.mz, 6)}</h3><p>{r.reason}.</p></li>
        ) : (
          <ExpectedCard key={i} row={r} hazard={hazards[good.indexOf(r)]} readForm={readForm} readDc={readDc} built={built!} maxRf={profile.maxRfAmplitude} />
        ))}
      </ul>

      <div class="card">
        <h2 class="card-title">{profile.name}</h2>
        {errors.profile && <p class="field-error" role="alert">Profile: {errors.profile}</p>}
        {top !== null && (
          <Result label={`Top of the mass range at the supply's largest RF (${formatSi(profile.maxRfAmplitude, 'V 0-p')}, one rod to ground, apex q)`}
            value={`m/z ${formatNumber(top, 4)}`} testId="mass-range-top"
            note={{ label: 'Top of mass range from the supply’s largest RF', value: top, unit: 'u', origin: 'calculator', context: { maxRf: profile.maxRfAmplitude } }} />
        )}
      </div>

      <More title="Which m/z does a measured RF pass?" class="more-tool"><InverseCheck inputs={inputs} update={update} built={built} profile={profile} /></More>
      <More title="Proportionality check from read-backs" class="more-tool"><Proportionality inputs={inputs} update={update} profile={profile} /></More>
    </>
  );
}

function ExpectedCard(props: { row: Expected; hazard: HazardousLiveResult; readForm: (typeof RF_FORMS)[number]; readDc: (typeof DC_FORMS)[number]; built: BuiltLine; maxRf: number }) {
  const { row, hazard, readForm, readDc } = props;
  const mzText = formatNumber(row.mz, 6);
  const ctx = { mz: row.mz, scanLine: props.built.description };
  const rfRead = convertRf(row.rf, 'zeroToPeakPerRod', readForm);
  const dcRead = convertDc(row.dc, 'perRod', readDc);
  return (
    <li class="card" data-testid="expected-card" data-mz={row.mz}>
      <h3 class="card-title">
        m/z {mzText}
        {hazard.hazardous && <span class="tag tag-hv">⚠ hazardous live</span>}
      </h3>
      {row.rf > props.maxRf && (
        <p class="notice" data-testid="beyond-supply">Above this supply's largest RF ({formatSi(props.maxRf, 'V 0-p')}, one rod to ground): the instrument cannot reach m/z {mzText} at this frequency.</p>
      )}
      <Result label={`V, ${rfFormWords[readForm]} (read-back form)`} value={`${formatNumber(rfRead, 5)} ${rfFormUnit[readForm]}`} testId="rf-readback"
        note={{ label: `Expected RF at m/z ${mzText} (${rfFormWords[readForm]})`, value: rfRead, unit: rfFormUnitId[readForm], origin: 'calculator', context: ctx, typeId: 'rf-amplitude' }} />
      <Result label={`U, ${dcFormWords[readDc]} (read-back form)`} value={`${formatNumber(dcRead, 5)} V DC`} testId="dc-readback"
        note={{ label: `Expected DC at m/z ${mzText} (${dcFormWords[readDc]})`, value: dcRead, unit: dcFormUnitId[readDc], origin: 'calculator', context: ctx, typeId: 'dc-amplitude' }} />
      {row.band && (
        <Result label="Ideal pass band on this line" value={`${formatNumber(row.band.low, 6)}–${formatNumber(row.band.high, 6)} u (Δm ${formatNumber(row.band.width, 3)} u, m/Δm ${formatNumber(row.band.resolution, 4)})`}
          note={{ label: `Ideal peak width at m/z ${mzText}`, value: row.band.width, unit: 'u', origin: 'calculator', context: ctx }} />
      )}
      <Disclosure class="conventions" summary="All conventions">
        {RF_FORMS.map((form) => {
          const v = convertRf(row.rf, 'zeroToPeakPerRod', form);
          const hot = form.endsWith('PerRod') ? hazard.perRod.hazardous : hazard.betweenPairs.hazardous;
          return (
            <Result key={form} label={`RF ${rfFormWords[form]}`} value={`${formatNumber(v, 5)} ${rfFormUnit[form]}${hot ? ' ⚠' : ''}`}
              note={{ label: `Expected RF at m/z ${mzText} (${rfFormWords[form]})`, value: v, unit: rfFormUnitId[form], origin: 'calculator', context: ctx, typeId: 'rf-amplitude' }} />
          );
        })}
        {DC_FORMS.map((form) => {
          const v = convertDc(row.dc, 'perRod', form);
          const hot = form === 'perRod' ? Math.abs(v) > hazard.levels.dc : hazard.betweenPairs.dc > hazard.levels.dc;
          return (
            <Result key={form} label={`DC ${dcFormWords[form]}`} value={`${formatNumber(v, 5)} V${hot ? ' ⚠' : ''}`}
              note={{ label: `Expected DC at m/z ${mzText} (${dcFormWords[form]})`, value: v, unit: dcFormUnitId[form], origin: 'calculator', context: ctx, typeId: 'dc-amplitude' }} />
          );
        })}
        <p class="hint">⚠ marks a value above a hazardous-live level.</p>
      </Disclosure>
    </li>
  );
}
