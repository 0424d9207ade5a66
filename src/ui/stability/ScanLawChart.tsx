// The two scan laws across the mass range, as U/V against m/z: constant peak width (U/V climbs towards the
// apex as m/z grows) and constant resolution (flat), with the apex ratio above both.
import { useMemo } from 'preact/hooks';
import { apexRatio, constantResolutionScanLine, constantWidthScanLine, massForScanRf, type ScanLine } from '../../engine';
import type { InstrumentProfile } from '../../store';
import { Chart, type ChartOptions, type ChartPalette, type uPlot } from '../components/Chart';
import { NumberField } from '../components/Field';
import { formatNumber } from '../format';
import { tryEngine, type FieldErrors } from '../bench/engineErrors';
import { parseNumber, usePersistentInputs } from '../bench/inputs';
import { Result } from '../bench/NoteButton';
import { DraftProblem } from '../components/DraftProblem';

type LawInputs = { width: string; referenceMz: string; resolution: string };
const lawDefaults = (p: InstrumentProfile | null): LawInputs => ({ width: '1', referenceMz: p?.kind === 'rga' ? '28' : '219', resolution: p?.kind === 'rga' ? '100' : '500' });

const SAMPLES = 64;

/**
 * Columns [m/z, U/V constant Δm, U/V constant m/Δm, apex]. Sampled in V (up to the supply's largest RF): the
 * engine's inverse scan law gives the m/z centred at each V (one band solution each, cheap), and on a line
 * U = λV − δ the ratio is U/V = λ − δ/V. The constant-resolution line has U/V = λ everywhere.
 */
export function lawColumns(widthLine: ScanLine | null, resLine: ScanLine | null, maxRf: number, top: number, r0: number, frequency: number): (number | null)[][] {
  const masses: number[] = [];
  const widthRatio: (number | null)[] = [];
  if (widthLine) {
    for (let i = 1; i <= SAMPLES; i++) {
      const rf = (maxRf * i) / SAMPLES;
      const mz = massForScanRf({ line: widthLine, rf, r0, frequency });
      if (mz === null || !(mz > (masses[masses.length - 1] ?? 0))) continue;
      masses.push(mz);
      widthRatio.push(widthLine.slope - widthLine.offset / rf);
    }
  }
  if (masses.length < 2) {
    masses.length = 0;
    widthRatio.length = 0;
    for (let i = 1; i <= SAMPLES; i++) {
      masses.push((top * i) / SAMPLES);
      widthRatio.push(null);
    }
  }
  return [masses, widthRatio, masses.map(() => resLine?.slope ?? null), masses.map(() => apexRatio())];
}

export function ScanLawChart(props: { profile: InstrumentProfile; top: number }) {
  const { profile, top } = props;
  const [inputs, update, inputsProblem] = usePersistentInputs<LawInputs>('scanlaw', lawDefaults);
  const errors: FieldErrors = {};
  const r0 = profile.rodFieldRadius;
  const frequency = profile.rfFrequency;
  const w = parseNumber(inputs.width, 'Peak width Δm', '1');
  const ref = parseNumber(inputs.referenceMz, 'Reference m/z', '219');
  const res = parseNumber(inputs.resolution, 'Resolution m/Δm', '500');
  if (!w.ok) errors.width = w.message;
  if (!ref.ok) errors.referenceMz = ref.message;
  if (!res.ok) errors.resolution = res.message;
  const widthLine = w.ok && ref.ok ? tryEngine(() => constantWidthScanLine({ width: w.value, referenceMz: ref.value, r0, frequency }), { width: 'width', referenceMz: 'referenceMz' }, errors, 'width') : null;
  const resLine = res.ok ? tryEngine(() => constantResolutionScanLine(res.value), { resolution: 'resolution' }, errors, 'resolution') : null;

  // 64 inverse band solutions: a few ms, redone only when a setting changes.
  const data = useMemo(
    () => lawColumns(widthLine, resLine, profile.maxRfAmplitude, top, r0, frequency) as unknown as uPlot.AlignedData,
    // The lines are rebuilt on every render; their slope and offset are what the columns depend on.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [widthLine?.slope, widthLine?.offset, resLine?.slope, top, r0, frequency, profile.maxRfAmplitude],
  );

  const options = useMemo(() => ({ ink, grid, teal, amber }: ChartPalette): ChartOptions => {
    return {
      legend: { show: false },
      cursor: { drag: { x: false, y: false }, points: { show: false }, x: false, y: false },
      scales: { x: { time: false } },
      axes: [
        { label: 'm/z (u)', stroke: ink, grid: { stroke: grid, width: 1 }, ticks: { stroke: grid } },
        { label: 'U/V', stroke: ink, grid: { stroke: grid, width: 1 }, ticks: { stroke: grid }, size: 64, values: (_u, vals) => vals.map((v) => v.toFixed(4)) },
      ],
      series: [
        {},
        { label: 'constant Δm', stroke: teal, width: 3, points: { show: false } },
        { label: 'constant m/Δm', stroke: amber, width: 3, dash: [7, 4], points: { show: false } },
        { label: 'apex', stroke: ink, width: 1.5, dash: [2, 4], points: { show: false } },
      ],
    };
  }, []);

  return (
    <div class="card">
      <h2 class="card-title">Scan laws across the mass range</h2>
      <DraftProblem problem={inputsProblem} />
      <div class="pair">
        <NumberField id="law-width" label="Constant Δm" unit="u" value={inputs.width} error={errors.width} onInput={(t) => update({ width: t })} />
        <NumberField id="law-ref" label="set at m/z" unit="u" value={inputs.referenceMz} error={errors.referenceMz} onInput={(t) => update({ referenceMz: t })} />
      </div>
      <NumberField id="law-res" label="Constant m/Δm" value={inputs.resolution} error={errors.resolution} onInput={(t) => update({ resolution: t })} />
      <Chart data={data} options={options} height={260} zoomButtons testId="scanlaw-chart"
        label={`U/V against m/z up to ${formatNumber(top, 4)}: the constant-width line rises towards the apex ratio with m/z; the constant-resolution line is flat below it.`} />
      <ul class="legend" aria-label="Legend">
        <li><svg width="36" height="12" aria-hidden="true"><line x1="2" y1="6" x2="34" y2="6" stroke="currentColor" stroke-width="3" /></svg> constant Δm (solid): U = λ·V − δ</li>
        <li><svg width="36" height="12" aria-hidden="true"><line x1="2" y1="6" x2="34" y2="6" stroke="currentColor" stroke-width="3" stroke-dasharray="7 4" /></svg> constant m/Δm (dashed): U = λ·V</li>
        <li><svg width="36" height="12" aria-hidden="true"><line x1="2" y1="6" x2="34" y2="6" stroke="currentColor" stroke-width="2" stroke-dasharray="2 4" /></svg> apex ratio (dotted): nothing passes above it</li>
      </ul>
      {widthLine && (
        <Result label="Constant-Δm line" value={`U = ${formatNumber(widthLine.slope, 6)}·V − ${formatNumber(widthLine.offset, 4)} V`}
          note={{ label: `Constant-width scan line offset δ (Δm ${inputs.width.trim()} u at m/z ${inputs.referenceMz.trim()})`, value: widthLine.offset, unit: 'V', origin: 'calculator', context: { slope: widthLine.slope } }} />
      )}
      {resLine && (
        <Result label="Constant-m/Δm line" value={`U = ${formatNumber(resLine.slope, 7)}·V`}
          note={{ label: `Constant-resolution scan line slope (m/Δm ${inputs.resolution.trim()})`, value: resLine.slope, unit: '', origin: 'calculator' }} />
      )}
      <p class="hint">The constant-Δm line starts where its DC turns positive (U = λ·V − δ &gt; 0); below that m/z it cannot give that width.</p>
    </div>
  );
}
