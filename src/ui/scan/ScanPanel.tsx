// Scan: a measured scan pasted, picked from a file on this device (read here, never uploaded) or the demo scan;
// the plot, the peaks found, the expected isotope pattern of a formula laid over the measured cluster, and the
// verdict fit of one peak in the worker (progress, Cancel) against the ideal filter's peak.
import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import {
  DEMO_SCAN_INFO, DEMO_SCAN_TEXT, findPeaks, isotopePattern, readScan,
  type IsotopePeak, type PeakFitInstrument, type PeakFitResult, type Scan, type ScanPeak,
} from '../../spectrum';
import type { InstrumentProfile } from '../../store';
import { isAbortError, simClient, type SimClient } from '../../worker/client';
import { Chart } from '../components/Chart';
import { NumberField } from '../components/Field';
import { InputsFold, More } from '../components/Fold';
import { DraftProblem } from '../components/DraftProblem';
import { InstrumentLine } from '../components/InstrumentLine';
import { useDraft } from '../components/useDraft';
import { useApp } from '../context';
import { Result } from '../bench/NoteButton';
import { readCharge, readInRange } from './read';

/** Longest scan text kept (characters): well above readScan's own point limit in any column format. */
export const MAX_SCAN_TEXT = 2_000_000;

export interface ScanInputs {
  text: string;
  /** Where the text came from, in words ("demo scan", "file kestrel-0412.csv", "pasted"). */
  source: string;
  formula: string;
  charge: string;
  /** Fit settings: beam radius (mm), transverse energy (eV), starting ion energy (eV). */
  beamRadiusMm: string;
  transverseEnergy: string;
  ionEnergy: string;
  /** Centroid of the chosen peak, as text ('' = none chosen). */
  chosen: string;
}

export function scanDefaults(p: InstrumentProfile | null): ScanInputs {
  const beam = p ? Math.min(0.5, 0.1 * p.rodFieldRadius * 1e3) : 0.5;
  return { text: '', source: '', formula: '', charge: '1', beamRadiusMm: String(Number(beam.toPrecision(2))), transverseEnergy: '0.2', ionEnergy: String(p?.axialEnergy ?? 5), chosen: '' };
}

function isScanInputs(x: unknown): x is ScanInputs {
  const v = x as ScanInputs | null;
  return !!v && typeof v === 'object' && ['text', 'source', 'formula', 'charge', 'beamRadiusMm', 'transverseEnergy', 'ionEnergy', 'chosen'].every((k) => typeof (v as unknown as Record<string, unknown>)[k] === 'string');
}

export type ScanRead = { ok: true; scan: Scan; peaks: ScanPeak[] } | { ok: false; message: string } | { ok: null };

export function readScanText(text: string): ScanRead {
  if (text.trim() === '') return { ok: null };
  if (text.length > MAX_SCAN_TEXT) return { ok: false, message: `Scan text: ${text.length} characters; at most ${MAX_SCAN_TEXT} are accepted.` };
  try {
    const scan = readScan(text);
    return { ok: true, scan, peaks: findPeaks(scan) };
  } catch (err) {
    const m = (err as Error).message;
    return { ok: false, message: /[.!?]$/.test(m) ? m : `${m}.` };
  }
}

export interface IsotopeMatch {
  expected: IsotopePeak;
  /** Expected height after scaling to the measured cluster. */
  scaledHeight: number;
  peak: ScanPeak | null;
  /** Measured and expected height relative to the cluster's tallest expected peak, %. */
  measuredPercent: number | null;
  expectedPercent: number;
  /** measured − expected, percentage points. */
  errorPoints: number | null;
}

/** Expected pattern laid over the measured peaks: matched within half a unit of m/z per charge, scaled on the tallest. */
export function matchPattern(pattern: IsotopePeak[], peaks: ScanPeak[], charge: number): { matches: IsotopeMatch[]; scale: number } | null {
  const shown = pattern.filter((p) => p.abundance >= 0.005);
  if (shown.length === 0 || peaks.length === 0) return null;
  const window = 0.5 / Math.abs(charge);
  const nearest = (mz: number): ScanPeak | null => {
    let best: ScanPeak | null = null;
    for (const k of peaks) if (Math.abs(k.centroid - mz) <= window && (!best || Math.abs(k.centroid - mz) < Math.abs(best.centroid - mz))) best = k;
    return best;
  };
  const top = shown.reduce((a, b) => (b.abundance > a.abundance ? b : a));
  const topPeak = nearest(top.mz);
  if (!topPeak || !(topPeak.height > 0)) return null;
  const scale = topPeak.height / top.abundance;
  const matches = shown.map((e) => {
    const peak = nearest(e.mz);
    const expectedPercent = (100 * e.abundance) / top.abundance;
    const measuredPercent = peak ? (100 * peak.height) / topPeak.height : null;
    return { expected: e, scaledHeight: scale * e.abundance, peak, expectedPercent, measuredPercent, errorPoints: measuredPercent === null ? null : measuredPercent - expectedPercent };
  });
  return { matches, scale };
}

type FitState =
  | { status: 'idle' }
  | { status: 'running'; progress: number; mz: number }
  | { status: 'done'; result: PeakFitResult; mz: number; settings: string }
  | { status: 'failed'; message: string }
  | { status: 'cancelled' };

const fmt = (x: number, digits: number): string => (Number.isFinite(x) ? x.toFixed(digits) : '—');
const fmtG = (x: number, digits = 4): string => (Number.isFinite(x) ? String(Number(x.toPrecision(digits))) : '—');

export function ScanPanel(props: { client?: SimClient }) {
  const { instrument } = useApp();
  const draft = useDraft<ScanInputs>({
    key: `inputs:scan:${instrument?.id ?? 'none'}`,
    initial: () => scanDefaults(instrument),
    what: 'the scan',
    kind: 'setting',
    whileLoading: 'initial',
    keep: Boolean(instrument),
    accept: isScanInputs,
  });
  const inputs = draft.value ?? scanDefaults(instrument);
  const update = (patch: Partial<ScanInputs>) => void draft.update(patch);
  const [fileProblem, setFileProblem] = useState<string | null>(null);
  const [fit, setFit] = useState<FitState>({ status: 'idle' });
  const controller = useRef<AbortController | null>(null);
  useEffect(() => () => controller.current?.abort(), []);

  const read = useMemo(() => readScanText(inputs.text), [inputs.text]);
  const formula = inputs.formula.trim();
  const charge = readCharge(inputs.charge, 'Charge');
  const z = charge.ok ? charge.value : null;
  const overlay = useMemo(() => {
    if (!read.ok || formula === '' || z === null) return null;
    try {
      const pattern = isotopePattern(formula, { charge: z });
      return { pattern, match: matchPattern(pattern, read.peaks, z), error: null };
    } catch (err) {
      const m = (err as Error).message;
      return { pattern: [], match: null, error: /[.!?]$/.test(m) ? m : `${m}.` };
    }
  }, [read, formula, z]);

  const chartData = useMemo(() => {
    if (!read.ok) return null;
    const xs = Array.from(read.scan.mz);
    const ys = Array.from(read.scan.intensity);
    const data: (number | null)[][] = [xs, ys];
    if (overlay?.match) {
      const sticks: (number | null)[] = xs.map(() => null);
      for (const m of overlay.match.matches) {
        let best = -1;
        for (let i = 0; i < xs.length; i++) if (best < 0 || Math.abs(xs[i] - m.expected.mz) < Math.abs(xs[best] - m.expected.mz)) best = i;
        if (best >= 0 && Math.abs(xs[best] - m.expected.mz) <= 0.5) sticks[best] = m.scaledHeight;
      }
      data.push(sticks);
    }
    return data;
  }, [read, overlay]);

  const chosenPeak = read.ok && inputs.chosen !== '' ? read.peaks.find((p) => p.centroid.toFixed(4) === inputs.chosen) ?? null : null;
  const isDemo = inputs.text === DEMO_SCAN_TEXT;

  // Fit settings: the demo scan states its own; otherwise this instrument's geometry and the typed beam values.
  const beam = readInRange(inputs.beamRadiusMm, 'Beam radius', 0.01, 5, 'mm', '0.4');
  const transverse = readInRange(inputs.transverseEnergy, 'Transverse energy', 0.001, 10, 'eV', '0.2');
  const ionEnergy = readInRange(inputs.ionEnergy, 'Starting ion energy', 0.5, 100, 'eV', '5');
  const beamError = beam.ok && instrument && beam.value * 1e-3 >= instrument.rodFieldRadius
    ? `Beam radius: must be below the field radius r0 = ${fmtG(instrument.rodFieldRadius * 1e3, 3)} mm.` : null;
  const fitInstrument: PeakFitInstrument | null = isDemo
    ? { ...DEMO_SCAN_INFO.settings, charge: charge.ok ? charge.value : 1 }
    : instrument && beam.ok && transverse.ok && !beamError
      ? { r0: instrument.rodFieldRadius, frequency: instrument.rfFrequency, rodLength: instrument.rodLength, beamRadius: beam.value * 1e-3, transverseEnergy: transverse.value, charge: charge.ok ? charge.value : 1 }
      : null;

  function runFit(peak: ScanPeak) {
    if (!read.ok || !fitInstrument || !ionEnergy.ok) return;
    controller.current?.abort();
    const c = new AbortController();
    controller.current = c;
    const mz = peak.centroid;
    const settings = isDemo ? `the demo scan's own settings (r0 ${DEMO_SCAN_INFO.settings.r0 * 1e3} mm, ${DEMO_SCAN_INFO.settings.frequency / 1e6} MHz)` : `${instrument?.name ?? 'this instrument'}'s geometry`;
    setFit({ status: 'running', progress: 0, mz });
    (props.client ?? simClient())
      .run('peakFit', { scan: { mz: read.scan.mz, intensity: read.scan.intensity }, peakMz: mz, instrument: fitInstrument, axialVoltage: ionEnergy.value },
        { signal: c.signal, onProgress: (f) => controller.current === c && setFit({ status: 'running', progress: f, mz }) })
      .then((result) => controller.current === c && setFit({ status: 'done', result, mz, settings }))
      .catch((err: unknown) => {
        if (controller.current !== c) return;
        if (isAbortError(err)) setFit({ status: 'cancelled' });
        else setFit({ status: 'failed', message: err instanceof Error ? err.message : String(err) });
      });
  }

  async function pickFile(file: File) {
    setFileProblem(null);
    if (file.size > MAX_SCAN_TEXT) {
      setFileProblem(`File ${file.name}: ${Math.round(file.size / 1024)} kB; at most ${Math.round(MAX_SCAN_TEXT / 1024)} kB of text are accepted.`);
      return;
    }
    try {
      const text = await file.text();
      controller.current?.abort();
      setFit({ status: 'idle' });
      update({ text, source: `file ${file.name}`, chosen: '' });
    } catch (err) {
      setFileProblem(`File ${file.name} could not be read on this device: ${err instanceof Error ? err.message : String(err)}.`);
    }
  }

  const ctx: Record<string, string | number> = { scan: inputs.source || 'pasted', ...(formula ? { formula } : {}) };
  const fitOpen = fit.status !== 'idle';

  return (
    <>
      {instrument && <InstrumentLine profile={instrument} rods />}
      <div class="card answer" data-testid="scan-answer">
        {read.ok === null && <p class="muted">Paste a scan below, pick a file on this device, or load the demo scan.</p>}
        {read.ok === false && <p class="notice" role="alert" data-testid="scan-problem">{read.message}</p>}
        {read.ok && (
          <>
            <p class="hint" data-testid="scan-summary">
              {read.scan.mz.length} points, m/z {fmt(read.scan.mz[0], 3)} to {fmt(read.scan.mz[read.scan.mz.length - 1], 3)}
              {inputs.source ? ` · ${inputs.source}` : ''} · {read.peaks.length === 1 ? '1 peak found' : `${read.peaks.length} peaks found`}
            </p>
            {read.scan.sorted && <p class="notice" role="status" data-testid="scan-sorted">The lines were not in rising m/z; they were sorted before use.</p>}
            {chartData && (
              <Chart testId="scan-chart" label={`Measured scan${overlay?.match ? ' with the expected isotope pattern of ' + formula : ''}, ${read.scan.mz.length} points`}
                height={200} data={chartData as never} zoomButtons
                options={(pal) => ({
                  scales: { x: { time: false } },
                  axes: [{ label: 'm/z' }, { label: 'intensity' }],
                  series: [
                    { label: 'm/z' },
                    { label: 'measured', stroke: pal.teal, width: 1.5 },
                    ...(chartData.length > 2 ? [{ label: `expected ${formula}`, stroke: pal.amber, paths: () => null, points: { show: true, size: 9, fill: pal.amber } }] : []),
                  ],
                  legend: { show: chartData.length > 2 },
                })} />
            )}
            {read.peaks.length === 0 ? (
              <p class="notice" role="status">No peak stands out of the noise in this scan.</p>
            ) : (
              <div class="scroll-x">
                <table class="values compact" data-testid="peak-table">
                  <caption>Peaks found · tap one to check its shape</caption>
                  <thead><tr><th scope="col">m/z centroid</th><th scope="col">Height</th><th scope="col">FWHM (u)</th><th scope="col">m/Δm</th><th scope="col">Asym. 10 %</th></tr></thead>
                  <tbody>
                    {read.peaks.map((p) => {
                      const key = p.centroid.toFixed(4);
                      const on = key === inputs.chosen;
                      return (
                        <tr key={key} class={on ? 'row-chosen' : undefined}>
                          <td><button type="button" class="btn btn-small link-btn" aria-pressed={on ? 'true' : 'false'} data-testid="peak-choose"
                            onClick={() => update({ chosen: on ? '' : key })}>{key}</button></td>
                          <td>{fmtG(p.height, 4)}</td>
                          <td>{p.fwhm > 0 ? fmt(p.fwhm, 3) : '—'}</td>
                          <td>{p.resolution > 0 ? fmt(p.resolution, 0) : '—'}</td>
                          <td>{p.asymmetry > 0 ? fmt(p.asymmetry, 2) : '—'}</td>
                        </tr>
                      );
                    })}
                  </tbody>
                </table>
              </div>
            )}
            {overlay?.error && <p class="notice" role="alert" data-testid="overlay-problem">{overlay.error}</p>}
            {overlay && !overlay.error && !overlay.match && <p class="notice" role="status">No measured peak lies within ½ u of {formula}'s most abundant isotope peak; the expected pattern is not laid over the scan.</p>}
            {overlay?.match && (
              <div data-testid="ratio-table">
                <h3>Isotope ratios of {formula} (tallest = 100 %)</h3>
                {overlay.match.matches.map((m) => (
                  <Result key={m.expected.mz} label={`m/z ${m.expected.mz.toFixed(3)}: expected ${m.expectedPercent.toFixed(1)} %`}
                    value={m.measuredPercent === null || m.errorPoints === null ? 'not found among the peaks' : `measured ${m.measuredPercent.toFixed(1)} % (${m.errorPoints >= 0 ? '+' : '−'}${Math.abs(m.errorPoints).toFixed(1)} points)`}
                    note={m.errorPoints === null ? null : { label: `Isotope ratio error of ${formula} at m/z ${m.expected.mz.toFixed(2)}`, value: m.errorPoints, unit: '%', origin: 'calculator', context: ctx }} />
                ))}
              </div>
            )}
          </>
        )}
      </div>

      {chosenPeak && (
        <div class="card" data-testid="chosen-peak">
          <h2 class="card-title">Measured peak at m/z {chosenPeak.centroid.toFixed(4)}</h2>
          <Result label="Centroid" value={`${chosenPeak.centroid.toFixed(4)}`} note={{ label: 'Measured peak centroid', value: chosenPeak.centroid, unit: 'u', origin: 'calculator', context: ctx }} />
          {chosenPeak.fwhm > 0 && <Result label="FWHM" value={`${chosenPeak.fwhm.toFixed(3)} u`} testId="chosen-fwhm" note={{ label: `Measured peak FWHM at m/z ${chosenPeak.centroid.toFixed(2)}`, value: chosenPeak.fwhm, unit: 'u', origin: 'calculator', context: ctx }} />}
          {chosenPeak.resolution > 0 && <Result label="Resolution m/Δm (FWHM)" value={chosenPeak.resolution.toFixed(0)} note={{ label: `Measured peak resolution at m/z ${chosenPeak.centroid.toFixed(2)}`, value: chosenPeak.resolution, unit: '', origin: 'calculator', context: ctx }} />}
          {chosenPeak.asymmetry > 0 && <Result label="Asymmetry at 10 % (trailing ÷ leading)" value={chosenPeak.asymmetry.toFixed(2)} note={{ label: `Measured peak asymmetry at m/z ${chosenPeak.centroid.toFixed(2)}`, value: chosenPeak.asymmetry, unit: '', origin: 'calculator', context: ctx }} />}
          {!fitInstrument && !isDemo && <p class="notice" role="status">{!instrument ? 'Pick an instrument first: the fit uses its field radius, rod length and RF frequency.' : 'Fix the fit settings below to check the shape.'}</p>}
          <div class="row">
            <button type="button" class="btn btn-primary" data-testid="fit-run" disabled={!fitInstrument || !ionEnergy.ok || fit.status === 'running'} onClick={() => runFit(chosenPeak)}>
              Check the shape against the ideal filter
            </button>
            {fit.status === 'running' && <button type="button" class="btn" data-testid="fit-cancel" onClick={() => controller.current?.abort()}>Cancel</button>}
          </div>
          {isDemo && <p class="hint">The demo scan is fitted with the settings it was made with (invented instrument Kestrel, r0 {DEMO_SCAN_INFO.settings.r0 * 1e3} mm, {DEMO_SCAN_INFO.settings.frequency / 1e6} MHz, rods {DEMO_SCAN_INFO.settings.rodLength * 1e3} mm).</p>}
        </div>
      )}

      {fitOpen && <FitView state={fit} ctx={ctx} />}

      <DraftProblem problem={draft.problem} />
      <InputsFold id="scan-fold" testId="scan-fold" invalid={read.ok !== true || !!overlay?.error || !charge.ok || !beam.ok || !transverse.ok || !ionEnergy.ok || !!beamError}
        summary={`${inputs.source || (read.ok ? 'pasted scan' : 'no scan yet')}${formula ? ` · ${formula}` : ''} · beam ${inputs.beamRadiusMm.trim() || '—'} mm`}>
        <form class="card form" onSubmit={(e) => e.preventDefault()}>
          <h2 class="card-title">Scan</h2>
          <div class="row">
            <button type="button" class="btn" data-testid="load-demo" onClick={() => {
              controller.current?.abort();
              setFit({ status: 'idle' });
              update({ text: DEMO_SCAN_TEXT, source: 'demo scan (invented)', formula: inputs.formula.trim() ? inputs.formula : DEMO_SCAN_INFO.formula, chosen: '' });
            }}>Load the demo scan</button>
            <label class="btn file-btn">
              Pick a file…
              <input type="file" class="file-input" aria-label="Pick a scan file on this device" accept=".csv,.txt,.tsv,.xy,text/plain,text/csv" data-testid="scan-file"
                onChange={(e) => {
                  const f = (e.target as HTMLInputElement).files?.[0];
                  if (f) void pickFile(f);
                  (e.target as HTMLInputElement).value = '';
                }} />
            </label>
          </div>
          {fileProblem && <p class="field-error" role="alert">{fileProblem}</p>}
          <div class={read.ok === false ? 'field has-error' : 'field'}>
            <label for="scan-text">Scan text (m/z and intensity per line)</label>
            <textarea id="scan-text" rows={6} spellcheck={false} value={inputs.text} aria-invalid={read.ok === false ? 'true' : 'false'}
              onInput={(e) => {
                controller.current?.abort();
                setFit({ status: 'idle' });
                update({ text: (e.target as HTMLTextAreaElement).value, source: 'pasted', chosen: '' });
              }} />
            <p class="hint">Two columns: comma, tab, spaces, or semicolons with a decimal comma; header lines and # comments are skipped. A file is read on this device only; nothing is uploaded.</p>
            {read.ok === false && <p class="field-error" role="alert">{read.message}</p>}
          </div>
          <div class="pair">
            <NumberField id="scan-formula" label="Formula to compare (optional)" inputMode="text" value={inputs.formula} error={overlay?.error}
              hint="e.g. C4F9; its isotope pattern is laid over the measured cluster." onInput={(t) => update({ formula: t })} />
            <NumberField id="scan-charge" label="Charge" inputMode="text" value={inputs.charge} error={charge.ok ? null : charge.message}
              hint="Non-zero whole number, −100 to 100." onInput={(t) => update({ charge: t })} />
          </div>
          <h2 class="card-title">Fit settings</h2>
          <div class="pair">
            <NumberField id="scan-beam" label="Beam radius" unit="mm" value={inputs.beamRadiusMm} error={beam.ok ? beamError : beam.message}
              hint="0.01 to 5 mm, below r0." onInput={(t) => update({ beamRadiusMm: t })} />
            <NumberField id="scan-transverse" label="Transverse energy" unit="eV" value={inputs.transverseEnergy} error={transverse.ok ? null : transverse.message}
              hint="0.001 to 10 eV." onInput={(t) => update({ transverseEnergy: t })} />
          </div>
          <NumberField id="scan-ion-energy" label="Starting ion energy" unit="eV per charge" value={inputs.ionEnergy} error={ionEnergy.ok ? null : ionEnergy.message}
            hint="0.5 to 100 eV; the fit starts here and finds its own." onInput={(t) => update({ ionEnergy: t })} />
        </form>
      </InputsFold>
    </>
  );
}

function FitView(props: { state: FitState; ctx: Record<string, string | number> }) {
  const s = props.state;
  const data = useMemo(() => (s.status === 'done' ? ([Array.from(s.result.mz), Array.from(s.result.measured), Array.from(s.result.fitted)] as [number[], number[], number[]]) : null), [s]);
  if (s.status === 'running') {
    return (
      <div class="card" data-testid="fit-running" aria-live="polite">
        <p>Fitting the ideal peak to m/z {s.mz.toFixed(3)}… {Math.round(100 * s.progress)} %</p>
        <progress max={1} value={s.progress} aria-label="Fit progress" />
      </div>
    );
  }
  if (s.status === 'cancelled') return <p class="notice" role="status" data-testid="fit-cancelled">The fit was cancelled; nothing was changed.</p>;
  if (s.status === 'failed') return <p class="notice" role="alert" data-testid="fit-failed">The fit could not be done: {s.message}</p>;
  if (s.status !== 'done') return null;
  const r = s.result;
  const v = r.verdict;
  const ctx = { ...props.ctx, peak: Number(r.peak.centroid.toFixed(4)) };
  const pm = (f: { value: number; sigma: number }, digits: number, unit = '') =>
    `${fmt(f.value, digits)}${Number.isFinite(f.sigma) ? ` ± ${fmtG(f.sigma, 2)}` : ''}${unit ? ' ' + unit : ''}`;
  return (
    <div class="card answer" data-testid="fit-result">
      <h2 class="card-title">Verdict · m/z {r.peak.centroid.toFixed(3)}</h2>
      <p class={v.explained ? 'scan-verdict verdict-pass' : 'scan-verdict verdict-fail'} data-testid="fit-verdict">
        <strong>{v.explained ? 'Explained by the operating point' : 'Not explained by the operating point'}</strong>
        {`: ${v.summary.replace(/^(Not explained|Explained) by the operating point[:.]?\s*/i, '')}`}
      </p>
      {data && (
        <Chart testId="fit-chart" label={`Measured peak and the fitted ideal peak near m/z ${r.peak.centroid.toFixed(2)}`} height={200} data={data}
          options={(pal) => ({
            scales: { x: { time: false } },
            axes: [{ label: 'm/z' }, { label: 'intensity' }],
            series: [{ label: 'm/z' }, { label: 'measured', stroke: pal.teal, width: 1.5 }, { label: 'ideal, fitted', stroke: pal.amber, width: 2, dash: [6, 4] }],
          })} />
      )}
      <Result label="U/V (DC ÷ RF ratio)" value={pm(r.ratio, 6)} note={{ label: 'Fitted U/V of the measured peak', value: r.ratio.value, unit: '', origin: 'calculator', context: ctx }} />
      <Result label="Ion energy" value={pm(r.axialVoltage, 2, 'eV')} note={{ label: 'Fitted ion energy of the measured peak', value: r.axialVoltage.value, unit: 'eV', origin: 'calculator', context: ctx }} />
      <Result label="m/z offset" value={pm(r.offset, 4, 'u')} testId="fit-offset" note={{ label: 'Fitted m/z offset of the measured peak', value: r.offset.value, unit: 'u', origin: 'calculator', context: ctx }} />
      <Result label="Height" value={`${fmtG(r.height.value)} ± ${fmtG(r.height.sigma, 2)}`} note={{ label: 'Fitted peak height', value: r.height.value, unit: '', origin: 'calculator', context: ctx }} />
      <p class="hint">FWHM measured {fmt(r.fwhmMeasured, 3)} u, ideal {fmt(r.fwhmModel, 3)} u · asymmetry measured {fmt(r.asymmetryMeasured, 2)}, ideal {fmt(r.asymmetryModel, 2)} · fitted with {s.settings}. Uncertainties are 1σ.</p>
      {v.details.length > 0 && (
        <ul class="verdict-details">{v.details.map((d) => <li key={d}>{d}</li>)}</ul>
      )}
      {!v.explained && (
        <div data-testid="fit-next">
          <p><a href="/diagnose">Diagnose → “Poor resolution or peak shape”</a>: the peak-shape tree walks through the causes step by step.</p>
          {v.usualCauses.length > 0 && (
            <>
              <p>Usual hardware causes (common practice):</p>
              <ul>{v.usualCauses.map((c) => <li key={c}>{c}</li>)}</ul>
            </>
          )}
          <p class="hint">Work on the hardware follows the maker's procedures and the site's rules: RF and high voltage stay off and the vacuum is vented properly before the rods or lenses are touched.</p>
        </div>
      )}
      <More title="What the model leaves out">
        <p data-testid="fit-limits">{v.limits}</p>
        <p>The ideal peak comes from an ideal hyperbolic field along the whole rod length, with no fringe fields at the ends; a real filter's entrance and exit fields, space charge and collisions change the shape.</p>
      </More>
    </div>
  );
}
