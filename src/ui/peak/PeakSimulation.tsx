// Peak simulation: the peak shape for the chosen instrument and settings, resolution at 50 % and 10 %, peak
// transmission, and the transmission-against-resolution curve. Runs in the worker; a moved slider cancels the
// stale run (the worker is terminated and restarts on the next run).
import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import { apexRatio, hazardousLive, type PeakProfile, type TransmissionVsResolution } from '../../engine';
import { isAbortError, simClient, SimClient } from '../../worker/client';
import { Chart } from '../components/Chart';
import { NumberField } from '../components/Field';
import { CautionLine, InputsFold, More } from '../components/Fold';
import { InstrumentLine } from '../components/InstrumentLine';
import { useApp } from '../context';
import { formatNumber, formatSi } from '../format';
import { useFromInputs, usePersistentInputs } from '../bench/inputs';
import { HvCaution } from '../bench/HvCaution';
import { Result } from '../bench/NoteButton';
import type { FieldErrors } from '../bench/engineErrors';
import { buildPeakRun, peakDefaults, SLIDERS, type PeakInputs, type PeakRun } from './peakInputs';
import type { InstrumentProfile } from '../../records';
import { DraftProblem } from '../components/DraftProblem';
import { NeedInstrument } from '../components/NeedInstrument';

type RunState<T> =
  | { status: 'idle' }
  | { status: 'running'; progress: number }
  | { status: 'done'; result: T; key: string }
  | { status: 'failed'; message: string };

/** The peak's run: as RunState, plus a coarse complete profile shown while the refined one computes. */
type PeakState = RunState<PeakProfile> | { status: 'coarse'; result: PeakProfile; key: string; progress: number };

/**
 * Start a run at most this long after the first unserved input change (later changes do not postpone it, so a
 * moving finger still gets runs; a computing run is protected, below).
 */
const SETTLE_MS = 40;
/**
 * A run that is computing (it reported progress within this time) keeps going after an input change until its
 * coarse profile is on screen — so a moving finger still sees the peak redrawn — but for no longer than this
 * after the change; the newest inputs start right after. A run still refining, or not yet under way, is
 * cancelled at once.
 */
const COARSE_WAIT_MS = 600;

/** Progress is redrawn when it has moved by at least this fraction, and at most once in this time. */
const PROGRESS_STEP = 0.05;
const PROGRESS_EVERY_MS = 250;

const NO_ERRORS: FieldErrors = {};

/** The run for these inputs on this instrument, with the messages for the fields. */
function operatingRun(inputs: PeakInputs, instrument: InstrumentProfile): { run: PeakRun | null; errors: FieldErrors } {
  const errors: FieldErrors = {};
  return { run: buildPeakRun(inputs, instrument, errors), errors };
}

interface ActiveRun {
  key: string;
  controller: AbortController;
  /** Date.now() of the last progress message (0: none yet). */
  lastProgress: number;
  /** Date.now() when progress was last put on screen (0: not yet). */
  progressShownAt: number;
  /** While a newer input waits for this run's coarse profile: when the wait ends. */
  waitUntil: number | null;
  coarseShown: boolean;
}

/** The curve runs in a worker of its own, so a slider move (which terminates the peak worker) does not kill it. */
let curveWorkerClient: SimClient | null = null;

/** `clock` gives the time in ms (Date.now by default): the hand-over rule below is about time, so tests set it. */
export function PeakSimulation(props: { client?: SimClient; curveClient?: SimClient; clock?: () => number }) {
  const { instrument } = useApp();
  const client = props.client ?? simClient();
  const clock = props.clock ?? Date.now;
  const curveClient = props.curveClient ?? (curveWorkerClient ??= new SimClient());
  const [inputs, update, inputsProblem] = usePersistentInputs<PeakInputs>('peak', peakDefaults);
  const [peak, setPeak] = useState<PeakState>({ status: 'idle' });
  const [curve, setCurve] = useState<RunState<TransmissionVsResolution>>({ status: 'idle' });
  const curveController = useRef<AbortController | null>(null);
  // The last finished (or coarse) peak stays on screen while a newer run computes (marked busy).
  const lastDone = useRef<PeakProfile | null>(null);
  // Whether the peak on screen is a coarse one (error ≤ 1 % of the peak height, not 0.1 %).
  const lastCoarse = useRef(false);
  if (peak.status === 'done' || peak.status === 'coarse') {
    lastDone.current = peak.result;
    lastCoarse.current = peak.status === 'coarse';
  }

  // The operating point (exact stability edges) once per inputs and instrument, not on each of the many redraws a
  // run's progress brings.
  const model = useFromInputs(inputs, instrument, operatingRun);
  const run = model?.run ?? null;
  const errors = model?.errors ?? NO_ERRORS;
  const runKey = run?.key ?? null;

  const active = useRef<ActiveRun | null>(null);
  const wanted = useRef<typeof run>(null);
  wanted.current = run;
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const unservedSince = useRef<number | null>(null);

  function clearTimer(): void {
    if (timer.current !== null) clearTimeout(timer.current);
    timer.current = null;
  }

  function cancelActive(): void {
    active.current?.controller.abort();
    active.current = null;
  }

  /** Start the newest wanted run now (cancelling whatever still runs). */
  function startWanted(): void {
    clearTimer();
    unservedSince.current = null;
    cancelActive();
    const next = wanted.current;
    if (!next) return;
    const entry: ActiveRun = { key: next.key, controller: new AbortController(), lastProgress: 0, progressShownAt: 0, waitUntil: null, coarseShown: false };
    active.current = entry;
    const handOver = (): void => {
      // A newer input waited for this run's coarse profile: start it now.
      if (active.current === entry && wanted.current && wanted.current.key !== entry.key) startWanted();
    };
    client
      .run('peakProfile', next.params, {
        signal: entry.controller.signal,
        onProgress: (f) => {
          const now = clock();
          entry.lastProgress = now;
          if (active.current !== entry) return;
          // At most a few redraws a second for the progress line: each is a redraw of the whole screen.
          if (entry.progressShownAt !== 0 && now - entry.progressShownAt < PROGRESS_EVERY_MS && f < 1) return;
          entry.progressShownAt = now;
          // The line shows whole per cent in steps of PROGRESS_STEP: a redraw for every 1 % report would keep
          // the main thread busy while the worker computes.
          setPeak((s) => {
            const shown = s.status === 'running' || (s.status === 'coarse' && s.key === entry.key) ? s.progress : -1;
            if (shown >= 0 && f < 1 && Math.abs(f - shown) < PROGRESS_STEP) return s;
            return s.status === 'coarse' && s.key === entry.key ? { ...s, progress: f } : { status: 'running', progress: f };
          });
        },
        onPartial: (result) => {
          entry.coarseShown = true;
          setPeak({ status: 'coarse', result, key: entry.key, progress: 0 });
          handOver();
        },
      })
      .then((result) => {
        if (active.current === entry) active.current = null;
        setPeak({ status: 'done', result, key: entry.key });
      })
      .catch((error: unknown) => {
        if (active.current === entry) active.current = null;
        if (isAbortError(error)) return; // a newer run replaces this one
        setPeak({ status: 'failed', message: error instanceof Error ? error.message : String(error) });
      });
  }

  useEffect(() => {
    if (!run) {
      clearTimer();
      unservedSince.current = null;
      cancelActive();
      return;
    }
    const current = active.current;
    if (current && current.key === run.key) return;
    setPeak((s) => (s.status === 'running' ? s : { status: 'running', progress: 0 }));
    const now = clock();
    if (current && !current.coarseShown && now - current.lastProgress < COARSE_WAIT_MS && (current.waitUntil ?? now + 1) > now) {
      // Let it land its coarse profile (onPartial hands over); one that takes too long is replaced.
      if (current.waitUntil === null) {
        current.waitUntil = now + COARSE_WAIT_MS;
        clearTimer();
        timer.current = setTimeout(startWanted, COARSE_WAIT_MS);
      }
      return;
    }
    cancelActive();
    unservedSince.current ??= now;
    clearTimer();
    timer.current = setTimeout(startWanted, Math.max(0, unservedSince.current + SETTLE_MS - now));
    // runKey captures every input of the run.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [runKey]);
  useEffect(
    () => () => {
      clearTimer();
      cancelActive();
    },
    [],
  );

  // The T-vs-R curve belongs to the beam settings it was computed for: drop it when they change.
  useEffect(() => {
    curveController.current?.abort();
    setCurve({ status: 'idle' });
  }, [instrument?.id, inputs.mz, inputs.axialVoltage, inputs.beamRadiusMm, inputs.transverseEnergy]);
  useEffect(() => () => curveController.current?.abort(), []);

  // The peak on screen (the last finished or coarse one), kept while a newer run computes.
  const result = lastDone.current;
  const peakData = useMemo(() => {
    if (!result) return null;
    const percent = Float64Array.from(result.transmission, (t) => 100 * t);
    return [Array.from(result.mz), Array.from(percent)] as [number[], number[]];
  }, [result]);

  const curveData = useMemo(() => {
    if (curve.status !== 'done') return null;
    const rows: Array<[number, number]> = [];
    const r = curve.result;
    for (let i = 0; i < r.ratio.length; i++) {
      if (r.resolution50[i] > 0 && r.peakTransmission[i] > 0) rows.push([r.resolution50[i], 100 * r.peakTransmission[i]]);
    }
    rows.sort((a, b) => a[0] - b[0]);
    return [rows.map((x) => x[0]), rows.map((x) => x[1])] as [number[], number[]];
  }, [curve]);

  // The settings form is drawn again only when the inputs (or the instrument) change: a run's progress and results,
  // arriving while the worker computes, redraw the result card alone.
  const form = useMemo(() => instrument && (
      <InputsFold id="peak-inputs-fold" testId="peak-fold" invalid={Object.keys(errors).some((k) => k !== 'profile')}
        summary={`m/z ${inputs.mz.trim() || '—'} · m/Δm ${inputs.resolution.trim() || '—'} · ${inputs.axialVoltage.trim() || '—'} eV · beam ${inputs.beamRadiusMm.trim() || '—'} mm · transverse ${inputs.transverseEnergy.trim() || '—'} eV`}>
        <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="peak-settings-title">
          <h2 class="card-title" id="peak-settings-title">Settings · {instrument.name}</h2>
          <div class="pair">
            <NumberField id="peak-mz" label="m/z" unit="u" value={inputs.mz} error={errors.mz} onInput={(t) => update({ mz: t })} />
            <NumberField id="peak-resolution" label="Ideal resolution m/Δm" value={inputs.resolution} error={errors.resolution}
              onInput={(t) => update({ resolution: t })} hint="Sets U/V from the exact stability edges." />
          </div>
          <Slider id="peak-axial" label="Ion energy" unit="eV per charge" value={inputs.axialVoltage} range={SLIDERS.axialVoltage}
            error={errors.axialVoltage} onInput={(t) => update({ axialVoltage: t })} />
          <Slider id="peak-beam" label="Beam radius" unit="mm" value={inputs.beamRadiusMm} range={SLIDERS.beamRadiusMm}
            error={errors.beamRadiusMm} onInput={(t) => update({ beamRadiusMm: t })} />
          <Slider id="peak-transverse" label="Transverse energy" unit="eV" value={inputs.transverseEnergy} range={SLIDERS.transverseEnergy}
            error={errors.transverseEnergy} onInput={(t) => update({ transverseEnergy: t })} />
          {run && (
            <p class="hint" data-testid="peak-operating">
              U/V {formatNumber(run.ratio, 6)} · V {formatSi(run.rf, 'V 0-p')} and U {formatSi(run.dc, 'V')}, one rod to ground ·
              ideal band {formatNumber(run.band.low, 6)}–{formatNumber(run.band.high, 6)} u · {formatNumber(run.cycles, 3)} RF cycles in the rods
            </p>
          )}
        </form>
      </InputsFold>
  ), [model]); // eslint-disable-line react-hooks/exhaustive-deps -- model changes with the inputs' content and the instrument

  if (!instrument) return <NeedInstrument>Pick or add an instrument first: the simulation uses its field radius, rod length and frequency.</NeedInstrument>;

  function computeCurve() {
    if (!instrument || !run) return;
    curveController.current?.abort();
    const controller = new AbortController();
    curveController.current = controller;
    setCurve({ status: 'running', progress: 0 });
    const apex = apexRatio();
    // Ideal R from about 20 to 1400 (0.126/(apex − U/V) rule, Dawson 1976, from memory), geometric steps.
    const ratios = Array.from({ length: 10 }, (_, i) => apex - 0.126 / (20 * 1.6 ** i));
    curveClient
      .run(
        'transmissionVsResolution',
        {
          mz: run.params.mzFrom + 0.5 * (run.params.mzTo - run.params.mzFrom),
          r0: instrument.rodFieldRadius,
          frequency: instrument.rfFrequency,
          rodLength: instrument.rodLength,
          axialVoltage: run.params.axialVoltage,
          beamRadius: run.params.beamRadius,
          transverseEnergy: run.params.transverseEnergy,
          ratios,
          points: 41,
        },
        { signal: controller.signal, onProgress: (f) => setCurve({ status: 'running', progress: f }) },
      )
      .then((result) => setCurve({ status: 'done', result, key: '' }))
      .catch((error: unknown) => {
        if (isAbortError(error) && controller.signal.aborted) return; // we cancelled it
        setCurve({ status: 'failed', message: error instanceof Error ? error.message : String(error) });
      });
  }

  const hazard = run ? hazardousLive({ dc: run.dc, rf: run.rf }) : null;
  const stale = peak.status === 'running' || peak.status === 'coarse';
  const coarse = result !== null && lastCoarse.current;
  const mzText = inputs.mz.trim();
  const ctx: Record<string, string | number> = run
    ? { mz: mzText, resolutionSetting: inputs.resolution, ionEnergy: run.params.axialVoltage, beamRadius: run.params.beamRadius, transverseEnergy: run.params.transverseEnergy }
    : {};

  return (
    <>
      <InstrumentLine profile={instrument} rods />
      <DraftProblem problem={inputsProblem} />
      {form}
      {errors.profile && <p class="field-error" role="alert">Profile: {errors.profile}</p>}


      <div class="card" data-testid="peak-result" aria-busy={stale ? 'true' : 'false'}>
        <h2 class="card-title">Simulated peak</h2>
        <p class="hint status-row" role="status" data-testid="peak-status">
          {peak.status === 'running' && (
            <><progress max={1} value={peak.progress} aria-label="Simulation progress" /> Computing… {Math.round(100 * peak.progress)} %</>
          )}
          {coarse && peak.status !== 'failed' && (
            <span data-testid="peak-coarse">
              <strong>coarse — refining…</strong> (each point within 1 % of the peak height)
              {peak.status === 'coarse' && peak.progress > 0 && <> · <progress max={1} value={peak.progress} aria-label="Refinement progress" /> {Math.round(100 * peak.progress)} %</>}
            </span>
          )}
        </p>
        {peak.status === 'failed' && <p class="field-error" role="alert">The simulation stopped: {peak.message}</p>}
        <Chart key="peak" data={peakData} height={260} zoomButtons testId="peak-chart"
          label={result && peakData
            ? `Simulated transmission against m/z from ${formatNumber(peakData[0][0], 6)} to ${formatNumber(peakData[0][peakData[0].length - 1], 6)}; peak ${formatNumber(100 * result.peakTransmission, 3)} %`
            : 'The simulated peak is being computed'}
          options={({ teal }) => ({
            scales: { x: { time: false } },
            series: [{ label: 'm/z' }, { label: 'Transmission (%)', stroke: teal, width: 2 }],
            axes: [{ label: 'm/z' }, { label: 'Transmission (%)' }],
          })} />
        {!result && <div class="peak-results" aria-hidden="true" />}
        {result && (
          <div class="peak-results">
            <Result label="Peak transmission" value={`${formatNumber(100 * result.peakTransmission, 3)} % at m/z ${formatNumber(result.peakMz, 6)}`} testId="peak-transmission"
              note={{ label: `Simulated peak transmission at m/z ${mzText}`, value: 100 * result.peakTransmission, unit: '%', origin: 'calculator', context: ctx }} />
            <Result label="Resolution m/Δm at 50 % height" value={result.resolution50 > 0 ? formatNumber(result.resolution50, 4) : 'no measurable width in this range'} testId="peak-r50"
              note={result.resolution50 > 0 ? { label: `Simulated resolution (50 %) at m/z ${mzText}`, value: result.resolution50, unit: '', origin: 'calculator', context: ctx } : null} />
            <Result label="Resolution m/Δm at 10 % height" value={result.resolution10 > 0 ? formatNumber(result.resolution10, 4) : 'no measurable width in this range'} testId="peak-r10"
              note={result.resolution10 > 0 ? { label: `Simulated resolution (10 %) at m/z ${mzText}`, value: result.resolution10, unit: '', origin: 'calculator', context: ctx } : null} />
            {run && result.resolution10 > 0 && (
              <p class="hint" data-testid="peak-k">
                RF-cycles view: n²/(m/Δm at 10 %) = {formatNumber((run.cycles * run.cycles) / result.resolution10, 3)} for n = {formatNumber(run.cycles, 4)} cycles
                {' '}(the n²/K rule quotes K ≈ 12–20 for the base width; Paul, Reinhard &amp; von Zahn 1958 via Dawson 1976 and later reviews, from memory).
                Meaningful when the ideal band is much wider than the peak, i.e. when the flight, not U/V, sets the width.
              </p>
            )}
            <p class="hint">Numerical error of each point ≤ {coarse ? '1' : '0.1'} % of the peak height (deterministic: no counting noise).</p>
          </div>
        )}
      </div>

      {hazard?.hazardous && (
        <CautionLine testId="hv-short" text={<><strong>Hazardous live</strong> rods at these settings</>}>
          <HvCaution exceeded={hazard.exceeded} />
        </CautionLine>
      )}

      <More title="Transmission against resolution" class="more-tool"><div class="card" data-testid="peak-curve">
        <p class="hint">Steps U/V towards the apex at this m/z and these beam settings, and records the peak transmission against the resolution at 50 % height.</p>
        <div class="row">
          <button type="button" class="btn" onClick={computeCurve} disabled={!run || curve.status === 'running'}>Compute the curve</button>
          {curve.status === 'running' && (
            <button type="button" class="btn btn-small" onClick={() => { curveController.current?.abort(); setCurve({ status: 'idle' }); }}>Cancel</button>
          )}
        </div>
        {curve.status === 'running' && (
          <p class="hint" role="status"><progress max={1} value={curve.progress} aria-label="Curve progress" /> {Math.round(100 * curve.progress)} %</p>
        )}
        {curve.status === 'failed' && <p class="field-error" role="alert">The curve stopped: {curve.message}</p>}
        {curveData && curveData[0].length > 1 && (
          <Chart key="curve" data={curveData} height={240} testId="peak-curve-chart"
            label="Peak transmission in per cent against resolution m/Δm at 50 % height"
            options={({ amber }) => ({
              scales: { x: { time: false, distr: 3 } },
              series: [{ label: 'm/Δm (50 %)' }, { label: 'Peak transmission (%)', stroke: amber, width: 2, points: { show: true, fill: amber } }],
              axes: [{ label: 'm/Δm at 50 % (log)' }, { label: 'Peak transmission (%)' }],
            })} />
        )}
      </div></More>

      <More title="Model and its assumptions">
        <ul>
          <li>Ideal hyperbolic field over the whole rod length: no fringe fields at the ends, no collisions, no space charge, perfect rods and supplies.</li>
          <li>Singly charged ions, all with the same axial energy (the ion energy above), entering at a random RF phase (uniform over one period).</li>
          <li>Entry points spread evenly over a disc of the beam radius centred on the axis; sideways velocities random and Gaussian in x and y, with mean sideways kinetic energy equal to the transverse energy (half of it per axis).</li>
          <li>An ion is lost the moment it reaches the field radius r0 in x or y; the transmission is the fraction that reaches the exit.</li>
          <li>U and V one rod to ground, V zero-to-peak (x rods at +(U + V cos Ωt), y rods at −(U + V cos Ωt)); U/V set from the chosen ideal resolution using the exact stability edges, V puts the m/z near the apex q ≈ 0.706.</li>
          <li>Computed from the linear equations of motion (fundamental solutions, acceptance polygons, exact velocity integrals), checked against direct integration of individual ions.</li>
          <li>Real peaks are wider and lower: fringe fields, rod errors and RF ripple are not modelled.</li>
        </ul>
      </More>
    </>
  );
}

function Slider(props: {
  id: string;
  label: string;
  unit: string;
  value: string;
  range: { min: number; max: number; step: number };
  error?: string | null;
  onInput: (text: string) => void;
}) {
  const numeric = Number(props.value.replace(',', '.'));
  const position = Number.isFinite(numeric) ? Math.min(props.range.max, Math.max(props.range.min, numeric)) : props.range.min;
  return (
    <div class="slider-field">
      <NumberField id={props.id} label={props.label} unit={props.unit} value={props.value} error={props.error} onInput={props.onInput} />
      <input
        type="range"
        id={`${props.id}-slider`}
        min={props.range.min}
        max={props.range.max}
        step={props.range.step}
        value={position}
        aria-label={`${props.label} (${props.unit})`}
        onInput={(e) => props.onInput(String(Number((e.target as HTMLInputElement).value)))}
      />
    </div>
  );
}
