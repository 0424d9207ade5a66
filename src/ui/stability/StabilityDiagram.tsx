// Stability diagram: the first region with its x and y edges told apart (dash pattern and words), the apex,
// the operating line at the current U and V, the operating points of the listed m/z (shape and fill say
// pass / not pass), zoom to the apex, tap a point to read its values, and the pass band as an m/z interval.
import { useMemo, useRef, useState } from 'preact/hooks';
import {
  convertDc, convertRf, firstRegionApex, operatingPoint, passBandDetail, type OperatingPoint,
} from '../../engine';
import { HvCaution, isHazardousLive } from '../bench/HvCaution';
import type { InstrumentProfile } from '../../store';
import { Chart, CHART_FONT_FAMILY, type ChartOptions, type ChartPalette, type uPlot } from '../components/Chart';
import { NumberField, SelectField } from '../components/Field';
import { CautionLine, Disclosure, InputsFold, Later } from '../components/Fold';
import { InstrumentLine, scanLineSummary } from '../components/InstrumentLine';
import { useApp } from '../context';
import { formatNumber, formatSi } from '../format';
import { dcAs, dcFormOf, dcFormUnitId, dcFormWords, rfAs, rfFormOf, rfFormUnit, rfFormUnitId, rfFormWords } from '../bench/conventions';
import { tryEngine, type FieldErrors } from '../bench/engineErrors';
import { listHint, parseMzList, parseNumber, useFromInputs, usePersistentInputs } from '../bench/inputs';
import { Result } from '../bench/NoteButton';
import { buildScanLine, expectedFor } from '../bench/scanLine';
import { ScanLineFields } from '../bench/ScanLineFields';
import { diagramColumns, ISO_BETAS, placeLabels, Q_MAX, useBoundary } from './diagramData';
import { DraftProblem } from '../components/DraftProblem';
import { NeedInstrument } from '../components/NeedInstrument';

type StabilityInputs = {
  setMz: string; mzList: string; mode: string; width: string; referenceMz: string; resolution: string;
  source: string; measuredU: string; measuredV: string; isoBeta: string;
};

function stabilityDefaults(p: InstrumentProfile | null): StabilityInputs {
  const rga = p?.kind === 'rga';
  return {
    setMz: rga ? '28' : '69', mzList: rga ? '27, 28, 29, 32, 44' : '68, 69, 70, 219', mode: 'constant-width', width: '1',
    referenceMz: rga ? '28' : '219', resolution: rga ? '100' : '500', source: 'scan-line', measuredU: '', measuredV: '', isoBeta: 'no',
  };
}

export interface PlottedPoint {
  mz: number;
  set: boolean;
  op: OperatingPoint;
}

/** Finger-sized hit radius, CSS px. */
export const HIT_RADIUS = 32;

const WHOLE = { x: [0, Q_MAX] as [number, number], y: [-0.02, 0.32] as [number, number] };

/**
 * Where the filter is set and where each listed m/z sits: U and V (from the scan line or as measured), the operating
 * points and the pass band, with the messages for the fields (worked out through useFromInputs).
 */
function operatingModel(inputs: StabilityInputs, profile: InstrumentProfile) {
  const r0 = profile.rodFieldRadius;
  const frequency = profile.rfFrequency;
  const errors: FieldErrors = {};
  const setMz = parseNumber(inputs.setMz, 'Set m/z', '69');
  if (!setMz.ok) errors.setMz = setMz.message;
  const list = parseMzList(inputs.mzList, 'Other m/z');
  if (!list.ok) errors.mzList = list.message;
  const readForm = rfFormOf(profile.readbackConvention);
  const readDc = dcFormOf(profile.readbackConvention);

  // The current U and V: from the scan line at the set m/z, or as measured (read-back convention).
  let dc: number | null = null;
  let rf: number | null = null;
  let lineDescription = '';
  if (inputs.source === 'measured') {
    const u = parseNumber(inputs.measuredU, 'Measured U', '16.9');
    const v = parseNumber(inputs.measuredV, 'Measured V', '100.9');
    if (!u.ok) errors.measuredU = u.message;
    if (!v.ok) errors.measuredV = v.message;
    if (u.ok && v.ok) {
      dc = tryEngine(() => convertDc(u.value, readDc, 'perRod'), { value: 'measuredU' }, errors, 'measuredU');
      rf = tryEngine(() => convertRf(v.value, readForm, 'zeroToPeakPerRod'), { value: 'measuredV' }, errors, 'measuredV');
    }
    lineDescription = 'measured U and V';
  } else if (setMz.ok) {
    const built = buildScanLine(inputs, profile, errors);
    const expected = built ? expectedFor(setMz.value, built, profile, errors, 'setMz') : null;
    if (expected && 'rf' in expected) {
      dc = expected.dc;
      rf = expected.rf;
      lineDescription = built!.description;
    } else if (expected && 'reason' in expected) {
      errors.setMz = `At m/z ${setMz.value}: ${expected.reason}.`;
    }
  }

  // Voltage errors belong to the measured fields, or to the set m/z when U and V come from the scan line.
  const measured = inputs.source === 'measured';
  const uField = measured ? 'measuredU' : 'setMz';
  const vField = measured ? 'measuredV' : 'setMz';
  const points: PlottedPoint[] = [];
  if (dc !== null && rf !== null && list.ok && setMz.ok) {
    const masses = [setMz.value, ...list.values.filter((m) => m !== setMz.value)];
    for (const mz of masses) {
      const op = tryEngine(() => operatingPoint({ mz, r0, frequency, dc: dc!, rf: rf! }), { mz: mz === setMz.value ? 'setMz' : 'mzList', dc: uField, rf: vField }, errors, 'mzList');
      if (op) points.push({ mz, set: mz === setMz.value, op });
    }
  }
  const band = dc !== null && rf !== null && rf > 0 ? tryEngine(() => passBandDetail({ dc: dc!, rf: rf!, r0, frequency }), { dc: uField, rf: vField }, errors, vField) : null;
  return { errors, setMz, list, readForm, readDc, dc, rf, lineDescription, measured, points, band };
}

export function StabilityDiagram() {
  const { instrument } = useApp();
  const [inputs, update, inputsProblem] = usePersistentInputs<StabilityInputs>('stability', stabilityDefaults);
  const [selected, setSelected] = useState<number | null>(null);
  const [view, setView] = useState<{ key: number; ranges: Record<string, [number, number]> } | null>(null);
  const [tapMiss, setTapMiss] = useState(false);
  const pointsRef = useRef<PlottedPoint[]>([]);
  const selectedRef = useRef<number | null>(null);
  selectedRef.current = selected;
  const options = useMemo(() => (palette: ChartPalette) => chartOptions(palette, pointsRef, selectedRef), []);
  const boundary = useBoundary();

  const model = useFromInputs(inputs, instrument, operatingModel);

  if (!instrument || !model) return <NeedInstrument key="no-instrument">Pick or add an instrument first: the diagram uses its geometry.</NeedInstrument>;
  const profile = instrument;
  const { errors, setMz, list, readForm, readDc, dc, rf, lineDescription, measured, points, band } = model;
  pointsRef.current = points;
  const setPoint = points.find((p) => p.set) ?? null;
  const slope = setPoint && setPoint.op.q > 0 ? setPoint.op.a / setPoint.op.q : null;
  const showIso = inputs.isoBeta === 'yes';
  const data = boundary ? (diagramColumns(slope, showIso) as unknown as uPlot.AlignedData) : null;
  const apex = firstRegionApex();
  const chosen = selected !== null ? points.find((p) => p.mz === selected) ?? null : null;
  const redrawKey = points.map((p) => `${p.mz}:${p.op.q}:${p.op.a}`).join('|') + `#${selected}`;

  function onTap(q: number, a: number, u: uPlot) {
    const tx = u.valToPos(q, 'x');
    const ty = u.valToPos(a, 'y');
    let best: PlottedPoint | null = null;
    let bestDistance = Infinity;
    for (const p of pointsRef.current) {
      const d = Math.hypot(u.valToPos(p.op.q, 'x') - tx, u.valToPos(p.op.a, 'y') - ty);
      if (d < bestDistance) {
        bestDistance = d;
        best = p;
      }
    }
    if (best && bestDistance <= HIT_RADIUS) {
      setSelected(best.mz);
      setTapMiss(false);
    } else setTapMiss(true);
  }

  const inputsInvalid = !!(errors.setMz || errors.mzList || errors.measuredU || errors.measuredV || errors.width || errors.referenceMz || errors.resolution);
  // The other m/z as typed, without the set one (it leads the summary).
  const others = inputs.mzList.split(/[;,\s]+/).filter((t) => t && t !== inputs.setMz.trim()).join(', ');
  const summary = measured
    ? `measured U ${inputs.measuredU.trim() || '—'} V · V ${inputs.measuredV.trim() || '—'} ${rfFormUnit[readForm]}${others ? ` · m/z ${others}` : ''}`
    : `m/z ${inputs.setMz.trim() || '—'}${others ? ` (+ ${others})` : ''} · ${scanLineSummary(inputs)}`;

  return (
    <>
      <InstrumentLine profile={profile} />
      <DraftProblem problem={inputsProblem} />
      <InputsFold id="stab-inputs-fold" summary={summary} invalid={inputsInvalid} testId="stability-fold">
        <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="stab-inputs">
          <h2 class="card-title" id="stab-inputs">Where the filter is set</h2>
          <SelectField id="stab-source" label="U and V from" value={inputs.source === 'measured' ? 'measured' : 'scan-line'}
            options={[{ value: 'scan-line', label: 'The scan line at the set m/z' }, { value: 'measured', label: 'Measured read-backs' }]}
            onChange={(v) => update({ source: v })} />
          <NumberField id="stab-set" label="Set m/z" unit="u" value={inputs.setMz} error={errors.setMz} onInput={(t) => update({ setMz: t })} />
          {inputs.source === 'measured' ? (
            <div class="pair">
              <NumberField id="stab-u" inputMode="text" label={`U (${dcFormWords[readDc]})`} unit="V" value={inputs.measuredU} error={errors.measuredU} onInput={(t) => update({ measuredU: t })} />
              <NumberField id="stab-v" label={`V (${rfFormWords[readForm]})`} unit={rfFormUnit[readForm]} value={inputs.measuredV} error={errors.measuredV} onInput={(t) => update({ measuredV: t })} />
            </div>
          ) : (
            <ScanLineFields idPrefix="stab" values={inputs} errors={errors} onChange={update} />
          )}
          <NumberField id="stab-list" inputMode="text" label="Other m/z to place on the diagram" value={inputs.mzList} error={errors.mzList} onInput={(t) => update({ mzList: t })}
            hint={<>Neighbours of the set m/z show which side of the band they fall on. {listHint(list)}</>} />
          {measured && dc !== null && rf !== null && isHazardousLive(dc, rf) && <HvCaution compact />}
          {errors.profile && <p class="field-error" role="alert">Profile: {errors.profile}</p>}
        </form>
      </InputsFold>

      <div class="card">
        <h2 class="card-title">First stability region</h2>
        <Chart data={data} options={options} height={300} zoomButtons zoomScales={['x', 'y']} view={view} redrawKey={redrawKey}
          onTap={onTap} testId="stability-chart"
          label={data
            ? `Stability diagram, a against q: the first region bounded by the y edge on the left and the x edge on the right, apex at q ${apex.q.toFixed(4)}, a ${apex.a.toFixed(5)}; ${points.length} operating points, listed below.`
            : 'The stability diagram is being computed'} />
        <div class="row" role="group" aria-label="Chart view">
          <button type="button" class="btn btn-small" onClick={() => setView({ key: Date.now(), ranges: { x: WHOLE.x, y: WHOLE.y } })}>Whole region</button>
          <button type="button" class="btn btn-small" data-testid="zoom-apex"
            onClick={() => setView({ key: Date.now(), ranges: { x: [apex.q - 0.016, apex.q + 0.016], y: [apex.a - 0.012, apex.a + 0.006] } })}>Apex close-up</button>
        </div>
        <label class="check">
          <input type="checkbox" checked={showIso} onChange={(e) => update({ isoBeta: (e.target as HTMLInputElement).checked ? 'yes' : 'no' })} />
          Show iso-β lines (β = {ISO_BETAS.join(', ')})
        </label>
        <Disclosure class="legend-fold" summary="Legend: edges, operating line, markers">
        <p class="hint">Where each ion sits in the first stability region at the current U and V, and which m/z the filter passes.</p>
        <ul class="legend" aria-label="Legend">
          <li><LineSample dash="" width={3} /> x edge b₁(q), solid: right of the apex, the low-mass cut-off</li>
          <li><LineSample dash="7 4" width={3} /> y edge −a₀(q), dashed: left of the apex, the high-mass cut-off</li>
          <li><LineSample dash="2 4" width={2} /> operating line: every m/z at the current U and V</li>
          {showIso && <li><LineSample dash="" width={1} /> thin solid: β_x = {ISO_BETAS.join(', ')} (β_x reaches 1 on the x edge)</li>}
          {showIso && <li><LineSample dash="1 3" width={1} /> thin dotted: β_y = {ISO_BETAS.join(', ')} (β_y is 0 on the y edge and grows away from it)</li>}
          <li><Marker kind="pass" /> passes (filled circle)</li>
          <li><Marker kind="fail" /> does not pass (open square with a cross)</li>
          <li><Marker kind="apex" /> apex</li>
        </ul>
        </Disclosure>
        <p class="hint">{tapMiss ? 'No point within reach of that tap: tap closer to a point, or pick one from the list below.' : 'Tap a point (or a list entry below) to read its values. Use the zoom buttons: the chart has no pinch zoom.'}</p>
      </div>

      <Later>
      {chosen && <PointPanel point={chosen} />}

      {dc !== null && rf !== null && isHazardousLive(dc, rf) && (
        <CautionLine testId="hv-short" text={<><strong>Hazardous live</strong> rods at this setting</>}>
          <HvCaution compact />
        </CautionLine>
      )}

      {dc !== null && rf !== null && (
        <div class="card" data-testid="pass-band">
          <h2 class="card-title">Pass band</h2>
          {lineDescription && <p class="hint">From {lineDescription}.</p>}
          <Result label={`U, ${dcFormWords[readDc]} (read-back form)`} value={formatSi(dcAs(readDc, dc) ?? NaN, 'V DC', 5)}
            note={{ label: `DC at the current setting (set m/z ${inputs.setMz.trim()})`, value: dcAs(readDc, dc) ?? NaN, unit: dcFormUnitId[readDc], origin: inputs.source === 'measured' ? 'entered' : 'calculator', context: setMz.ok ? { mz: setMz.value } : {}, typeId: 'dc-amplitude' }} />
          <Result label={`V, ${rfFormWords[readForm]} (read-back form)`} value={`${formatNumber(rfAs(readForm, rf) ?? NaN, 5)} ${rfFormUnit[readForm]}`}
            note={{ label: `RF at the current setting (set m/z ${inputs.setMz.trim()})`, value: rfAs(readForm, rf) ?? NaN, unit: rfFormUnitId[readForm], origin: inputs.source === 'measured' ? 'entered' : 'calculator', context: setMz.ok ? { mz: setMz.value } : {}, typeId: 'rf-amplitude' }} />
          {band ? (
            <>
              <p class="big" data-testid="band-interval">
                {Number.isFinite(band.high) ? `m/z ${formatNumber(band.low, 6)} – ${formatNumber(band.high, 6)} passes` : `m/z above ${formatNumber(band.low, 6)} passes (RF only)`}
              </p>
              <Disclosure class="band-more" summary="Edges, width and U/V">
                <Result label="U/V (V zero-to-peak, one rod to ground)" value={formatNumber(dc / rf, 6)} testId="band-ratio"
                  note={{ label: 'DC/RF ratio U/V at the current setting', value: dc / rf, unit: '', origin: 'calculator' }} />
              <Result label="Lowest m/z passed (x edge, low-mass cut-off)" value={`${formatNumber(band.low, 6)} u`} testId="band-low"
                note={{ label: 'Pass band low-mass edge', value: band.low, unit: 'u', origin: 'calculator', context: { dc, rf } }} />
              {Number.isFinite(band.high) && (
                <Result label="Highest m/z passed (y edge, high-mass cut-off)" value={`${formatNumber(band.high, 6)} u`} testId="band-high"
                  note={{ label: 'Pass band high-mass edge', value: band.high, unit: 'u', origin: 'calculator', context: { dc, rf } }} />
              )}
              {Number.isFinite(band.width) && (
                <>
                  <Result label="Ideal band width Δm" value={`${formatNumber(band.width, 4)} u`}
                    note={{ label: 'Ideal pass-band width', value: band.width, unit: 'u', origin: 'calculator', context: { dc, rf } }} />
                  <Result label="Ideal resolution m/Δm" value={formatNumber(band.resolution, 4)}
                    note={{ label: 'Ideal resolution of the pass band', value: band.resolution, unit: '', origin: 'calculator', context: { dc, rf } }} />
                </>
              )}
              </Disclosure>
            </>
          ) : (
            <>
              <p data-testid="band-interval"><span class="verdict verdict-fail">✗ nothing passes</span> U/V is at or above the apex ratio: no m/z is stable in both directions.</p>
              <Result label="U/V (V zero-to-peak, one rod to ground)" value={formatNumber(dc / rf, 6)} testId="band-ratio"
                note={{ label: 'DC/RF ratio U/V at the current setting', value: dc / rf, unit: '', origin: 'calculator' }} />
            </>
          )}
        </div>
      )}

      <div class="card">
        <h2 class="card-title">Operating points</h2>
        <ol class="op-list" data-testid="op-list">
          {points.map((p) => (
            <li key={p.mz}>
              <button type="button" class="btn btn-small" aria-pressed={selected === p.mz} onClick={() => setSelected(p.mz)}>
                m/z {formatNumber(p.mz, 6)}{p.set ? ' (set)' : ''}: {p.op.firstRegion ? '✓ passes' : `✗ does not pass${p.op.cutSide ? ` — ${p.op.cutSide}` : ''}`}
              </button>
            </li>
          ))}
        </ol>
      </div>
      </Later>
    </>
  );
}

function PointPanel(props: { point: PlottedPoint }) {
  const { op, mz } = props.point;
  const xNearer = Math.abs(op.marginX) <= Math.abs(op.marginY);
  const nearestMargin = xNearer ? op.marginX : op.marginY;
  const ctx = { mz, q: op.q, a: op.a };
  const mzText = formatNumber(mz, 6);
  return (
    <div class="card point-panel" data-testid="point-panel" aria-live="polite">
      <h2 class="card-title">m/z {mzText}: {op.firstRegion ? <span class="verdict verdict-pass">✓ passes</span> : <span class="verdict verdict-fail">✗ does not pass</span>}</h2>
      <Result label="a" value={formatNumber(op.a, 6)} testId="panel-a" note={{ label: `Mathieu a at m/z ${mzText}`, value: op.a, unit: '', origin: 'calculator', context: ctx }} />
      <Result label="q" value={formatNumber(op.q, 6)} testId="panel-q" note={{ label: `Mathieu q at m/z ${mzText}`, value: op.q, unit: '', origin: 'calculator', context: ctx }} />
      <Result label="β_x" value={op.betaX === null ? 'unstable in x (lost)' : formatNumber(op.betaX, 5)} testId="panel-bx"
        note={op.betaX === null ? null : { label: `β_x at m/z ${mzText}`, value: op.betaX, unit: '', origin: 'calculator', context: ctx }} />
      <Result label="β_y" value={op.betaY === null ? 'unstable in y (lost)' : formatNumber(op.betaY, 5)} testId="panel-by"
        note={op.betaY === null ? null : { label: `β_y at m/z ${mzText}`, value: op.betaY, unit: '', origin: 'calculator', context: ctx }} />
      <Result label="Nearest edge" testId="panel-edge"
        value={`${xNearer ? 'x edge b₁ (low-mass cut-off)' : 'y edge −a₀ (high-mass cut-off)'}: ${nearestMargin >= 0 ? 'inside by' : 'outside by'} Δa = ${formatNumber(Math.abs(nearestMargin), 3)}`}
        note={{ label: `Distance in a to the nearest first-region edge at m/z ${mzText}`, value: nearestMargin, unit: '', origin: 'calculator', context: ctx }} />
      {op.stable && (
        <>
          <Result label="Secular frequency x (β_x·f/2)" value={formatSi(op.secularFrequencyX / 1e3, 'kHz', 4)}
            note={{ label: `Secular frequency x at m/z ${mzText}`, value: op.secularFrequencyX, unit: 'Hz', origin: 'calculator', context: ctx }} />
          <Result label="Secular frequency y (β_y·f/2)" value={formatSi(op.secularFrequencyY / 1e3, 'kHz', 4)}
            note={{ label: `Secular frequency y at m/z ${mzText}`, value: op.secularFrequencyY, unit: 'Hz', origin: 'calculator', context: ctx }} />
        </>
      )}
    </div>
  );
}

function LineSample(props: { dash: string; width: number }) {
  return (
    <svg width="36" height="12" aria-hidden="true"><line x1="2" y1="6" x2="34" y2="6" stroke="currentColor" stroke-width={props.width} stroke-dasharray={props.dash || undefined} /></svg>
  );
}

function Marker(props: { kind: 'pass' | 'fail' | 'apex' }) {
  return (
    <svg width="18" height="18" aria-hidden="true">
      {props.kind === 'pass' && <circle cx="9" cy="9" r="6" fill="currentColor" />}
      {props.kind === 'fail' && <><rect x="3" y="3" width="12" height="12" fill="none" stroke="currentColor" stroke-width="2" /><path d="M5 5l8 8M13 5l-8 8" stroke="currentColor" stroke-width="1.5" /></>}
      {props.kind === 'apex' && <path d="M9 2l7 7-7 7-7-7z" fill="none" stroke="currentColor" stroke-width="2" />}
    </svg>
  );
}

/** uPlot options, made once; the draw hook reads the latest points through refs. */
function chartOptions(palette: ChartPalette, pointsRef: { current: PlottedPoint[] }, selectedRef: { current: number | null }): ChartOptions {
  const { ink, grid, ok, bad } = palette;
  const xColour = palette.teal;
  const yColour = palette.amber;
  return {
    legend: { show: false },
    cursor: { drag: { x: false, y: false }, points: { show: false }, x: false, y: false },
    // x follows the data (q from 0 to Q_MAX) so an explicit zoom sticks; a fixed array would pin it.
    scales: { x: { time: false }, y: { range: WHOLE.y } },
    axes: [
      { label: 'q', stroke: ink, grid: { stroke: grid, width: 1 }, ticks: { stroke: grid } },
      { label: 'a', stroke: ink, grid: { stroke: grid, width: 1 }, ticks: { stroke: grid }, size: 46 },
    ],
    series: [
      {},
      { label: 'y edge −a₀', stroke: yColour, width: 3, dash: [7, 4], points: { show: false } },
      { label: 'x edge b₁', stroke: xColour, width: 3, points: { show: false } },
      { label: 'operating line', stroke: ink, width: 1.5, dash: [2, 4], points: { show: false } },
      ...ISO_BETAS.map((b) => ({ label: `β_x ${b}`, stroke: xColour, width: 1, spanGaps: true, points: { show: false } })),
      ...ISO_BETAS.map((b) => ({ label: `β_y ${b}`, stroke: yColour, width: 1, dash: [1, 3], spanGaps: true, points: { show: false } })),
    ],
    hooks: {
      draw: [
        (u: uPlot) => {
          const ctx = u.ctx;
          const dpr = devicePixelRatio || 1;
          ctx.save();
          ctx.beginPath();
          ctx.rect(u.bbox.left, u.bbox.top, u.bbox.width, u.bbox.height);
          ctx.clip();
          const apex = firstRegionApex();
          const ax = u.valToPos(apex.q, 'x', true);
          const ay = u.valToPos(apex.a, 'y', true);
          const s = 7 * dpr;
          ctx.lineWidth = 2 * dpr;
          ctx.strokeStyle = ink;
          ctx.beginPath();
          ctx.moveTo(ax, ay - s); ctx.lineTo(ax + s, ay); ctx.lineTo(ax, ay + s); ctx.lineTo(ax - s, ay); ctx.closePath();
          ctx.stroke();
          ctx.fillStyle = ink;
          // The axis numbers' font and size (uPlot rounds the size the same way), drawn ahead (warmCanvasFont).
          ctx.font = `${Math.round(12 * dpr)}px ${CHART_FONT_FAMILY}`;
          ctx.fillText('apex', ax + s + 3 * dpr, ay - s);
          // Point labels never overlap each other or the apex label (tightly packed ions in the whole-region view).
          const lineHeight = 12 * dpr;
          const apexBox = { x: ax + s + 3 * dpr, y: ay - s - lineHeight, w: ctx.measureText('apex').width, h: lineHeight };
          const ordered = [...pointsRef.current].sort((a, b) => Number(b.set) - Number(a.set));
          const spots = placeLabels(ordered.map((p) => ({
            x: u.valToPos(p.op.q, 'x', true), y: u.valToPos(p.op.a, 'y', true), r: (p.set ? 7 : 6) * dpr,
            w: ctx.measureText(`${p.mz}`).width, h: lineHeight,
          })), [apexBox]);
          const labelAt = new Map(ordered.map((p, i) => [p, spots[i]]));
          // Where each point sits, in CSS px of the plot overlay: for tests and for tap checks.
          u.over.dataset.points = JSON.stringify(pointsRef.current.map((p) => ({ mz: p.mz, x: u.valToPos(p.op.q, 'x'), y: u.valToPos(p.op.a, 'y') })));
          for (const p of pointsRef.current) {
            const x = u.valToPos(p.op.q, 'x', true);
            const y = u.valToPos(p.op.a, 'y', true);
            const r = (p.set ? 7 : 6) * dpr;
            if (p.op.firstRegion) {
              ctx.fillStyle = ok;
              ctx.beginPath(); ctx.arc(x, y, r, 0, 2 * Math.PI); ctx.fill();
            } else {
              ctx.strokeStyle = bad;
              ctx.lineWidth = 2 * dpr;
              ctx.strokeRect(x - r, y - r, 2 * r, 2 * r);
              ctx.beginPath(); ctx.moveTo(x - r * 0.7, y - r * 0.7); ctx.lineTo(x + r * 0.7, y + r * 0.7);
              ctx.moveTo(x + r * 0.7, y - r * 0.7); ctx.lineTo(x - r * 0.7, y + r * 0.7); ctx.stroke();
            }
            if (p.mz === selectedRef.current) {
              ctx.strokeStyle = ink;
              ctx.lineWidth = 2 * dpr;
              ctx.beginPath(); ctx.arc(x, y, r + 5 * dpr, 0, 2 * Math.PI); ctx.stroke();
            }
            const at = labelAt.get(p);
            if (at) {
              ctx.fillStyle = ink;
              ctx.fillText(`${p.mz}`, at.x, at.y);
            }
          }
          ctx.restore();
        },
      ],
    },
  };
}

