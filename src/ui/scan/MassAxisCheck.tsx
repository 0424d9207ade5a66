// Mass-axis check: calibrant ions (by formula or reference m/z) against the observed m/z, a line or quadratic fit,
// the residuals in ppm against m/z, and a verdict against the mass tolerance kept for this instrument.
import { useMemo } from 'preact/hooks';
import { fitMassAxis, ionMz, type MassAxisFit } from '../../spectrum';
import { Chart } from '../components/Chart';
import { NumberField, SelectField } from '../components/Field';
import { InputsFold, More } from '../components/Fold';
import { DraftProblem } from '../components/DraftProblem';
import { useDraft } from '../components/useDraft';
import { useApp } from '../context';
import { Result } from '../bench/NoteButton';
import { readCharge, readInRange } from './read';

export interface AxisRow {
  /** A formula (C4F9) or a reference m/z (218.985), as typed. */
  reference: string;
  observed: string;
}

export interface AxisInputs {
  rows: AxisRow[];
  charge: string;
  order: '1' | '2';
  /** Largest accepted |observed − reference|, u. */
  tolerance: string;
}

/** Mass errors within about ±0.1 u after calibration on a unit-resolution quadrupole (common practice). */
export const DEFAULT_TOLERANCE_U = '0.1';
export const MAX_ROWS = 24;

export const axisDefaults = (): AxisInputs => ({
  rows: [
    { reference: 'CF3', observed: '' },
    { reference: 'C4F9', observed: '' },
    { reference: 'C9F20N', observed: '' },
  ],
  charge: '1',
  order: '1',
  tolerance: DEFAULT_TOLERANCE_U,
});

function isAxisInputs(x: unknown): x is AxisInputs {
  const v = x as AxisInputs | null;
  return !!v && typeof v === 'object' && Array.isArray(v.rows) && v.rows.every((r) => r && typeof r.reference === 'string' && typeof r.observed === 'string')
    && typeof v.charge === 'string' && (v.order === '1' || v.order === '2') && typeof v.tolerance === 'string';
}

export interface AxisPoint {
  row: number;
  reference: number;
  observed: number;
  /** What the reference was: the formula as typed, or empty when an m/z was typed. */
  formula: string;
}

export interface AxisCheck {
  points: AxisPoint[];
  rowErrors: Record<number, { reference?: string; observed?: string }>;
  chargeError?: string;
  toleranceError?: string;
  tolerance: number | null;
  /** Largest |observed − reference| before any new calibration, u (and the row). */
  largest: { value: number; row: number } | null;
  fit: MassAxisFit | null;
  /** Ions listed without an observed m/z yet. */
  waiting: number;
  /** Why there is no fit (too few points, repeated observed m/z…), in a sentence. */
  refusal: string | null;
}

/** Reference m/z of a row: a number is taken as m/z, anything else as a formula of the given charge. */
function referenceOf(text: string, charge: number | null): { value: number; formula: string } | { error: string } {
  const t = text.trim();
  if (t === '') return { error: 'Reference: enter a formula (e.g. C4F9) or a reference m/z (e.g. 218.985).' };
  if (/^[\d.,]/.test(t)) {
    const n = readInRange(t, 'Reference m/z', 1, 100000, 'u', '218.985');
    return n.ok ? { value: n.value, formula: '' } : { error: n.message };
  }
  if (charge === null) return { error: 'Reference: fix the charge first.' };
  try {
    return { value: ionMz(t, charge), formula: t };
  } catch (err) {
    const m = (err as Error).message;
    return { error: /[.!?]$/.test(m) ? m : `${m}.` };
  }
}

export function checkAxis(inputs: AxisInputs): AxisCheck {
  const charge = readCharge(inputs.charge, 'Charge');
  const tol = readInRange(inputs.tolerance, 'Tolerance', 0.001, 5, 'u', '0.1');
  const points: AxisPoint[] = [];
  const rowErrors: AxisCheck['rowErrors'] = {};
  let waiting = 0;
  inputs.rows.forEach((row, i) => {
    if (row.reference.trim() === '' && row.observed.trim() === '') return; // a blank row is not a point
    const ref = referenceOf(row.reference, charge.ok ? charge.value : null);
    const errors: { reference?: string; observed?: string } = {};
    if ('error' in ref) errors.reference = ref.error;
    if (row.observed.trim() === '') {
      // An ion listed but not yet measured waits; only a wrong reference is marked.
      waiting += 1;
      if (errors.reference) rowErrors[i] = errors;
      return;
    }
    const obs = readInRange(row.observed, 'Observed m/z', 1, 100000, 'u', '219.02');
    if (!obs.ok) errors.observed = obs.message;
    if (errors.reference || errors.observed) rowErrors[i] = errors;
    else if ('value' in ref && obs.ok) points.push({ row: i, reference: ref.value, observed: obs.value, formula: ref.formula });
  });
  let largest: AxisCheck['largest'] = null;
  for (const p of points) {
    const e = Math.abs(p.observed - p.reference);
    if (!largest || e > largest.value) largest = { value: e, row: p.row };
  }
  const order = inputs.order === '2' ? 2 : 1;
  let fit: MassAxisFit | null = null;
  let refusal: string | null = null;
  const bad = Object.keys(rowErrors).length > 0;
  if (!bad) {
    const needed = order + 2;
    if (points.length === 0) refusal = null;
    else if (points.length < needed) refusal = `A ${order === 1 ? 'straight-line' : 'quadratic'} fit needs at least ${needed} ions with both values (you have ${points.length}${waiting > 0 ? `; ${waiting} more listed without an observed m/z` : ''}); add a row, or choose a straight line.`;
    else {
      const seen = new Set<number>();
      const repeated = points.find((p) => (seen.has(p.observed) ? true : (seen.add(p.observed), false)));
      if (repeated) refusal = `Observed m/z ${repeated.observed} appears twice: each ion needs its own observed m/z.`;
      else {
        try {
          fit = fitMassAxis(points.map((p) => ({ observed: p.observed, reference: p.reference })), order);
          if (!Number.isFinite(fit.rmsPpm) || !Number.isFinite(fit.maxAbsPpm)) {
            fit = null;
            refusal = 'The observed m/z values do not determine a fit; spread the ions across the range.';
          }
        } catch (err) {
          refusal = (err as Error).message;
        }
      }
    }
  }
  return {
    points, rowErrors, fit, refusal, largest, waiting,
    chargeError: charge.ok ? undefined : charge.message,
    toleranceError: tol.ok ? undefined : tol.message,
    tolerance: tol.ok ? tol.value : null,
  };
}

function signed(x: number, digits: number): string {
  return `${x >= 0 ? '+' : '−'}${Math.abs(x).toFixed(digits)}`;
}

export function MassAxisCheck() {
  const { instrument } = useApp();
  const draft = useDraft<AxisInputs>({
    key: `inputs:mass-axis:${instrument?.id ?? 'none'}`,
    initial: axisDefaults,
    what: 'the mass-axis check',
    kind: 'setting',
    whileLoading: 'initial',
    keep: Boolean(instrument),
    accept: isAxisInputs,
  });
  const inputs = draft.value ?? axisDefaults();
  const update = (patch: Partial<AxisInputs>) => void draft.update(patch);
  const setRow = (i: number, patch: Partial<AxisRow>) => void draft.update((cur) => ({ ...cur, rows: cur.rows.map((r, j) => (j === i ? { ...r, ...patch } : r)) }));
  const c = checkAxis(inputs);
  const fit = c.fit;

  const chartData = useMemo(() => {
    if (!fit) return null;
    const pairs = c.points.map((p, i) => [p.reference, fit.residualsPpm[i]] as [number, number]).sort((a, b) => a[0] - b[0]);
    return [pairs.map((p) => p[0]), pairs.map((p) => p[1])] as [number[], number[]];
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [fit]);

  const within = c.largest !== null && c.tolerance !== null ? c.largest.value <= c.tolerance : null;
  const largestResidualU = fit ? fit.residualsU.reduce((m, r) => Math.max(m, Math.abs(r)), 0) : null;
  const ctx: Record<string, string | number> = { ions: c.points.length, order: inputs.order, ...(c.tolerance !== null ? { toleranceU: c.tolerance } : {}) };
  const summary = `${c.points.length} ions · ${inputs.order === '2' ? 'quadratic' : 'line'} · tolerance ±${inputs.tolerance.trim() || '—'} u`;

  return (
    <>
      <div class="card answer" data-testid="axis-answer">
        {c.largest && c.tolerance !== null && (
          <p class={within ? 'scan-verdict verdict-pass' : 'scan-verdict verdict-fail'} data-testid="axis-verdict">
            {within
              ? `Within tolerance: the largest error is ${c.largest.value.toFixed(4)} u, inside ±${c.tolerance} u.`
              : `Outside tolerance: the largest error is ${c.largest.value.toFixed(4)} u, beyond ±${c.tolerance} u.`}
          </p>
        )}
        {c.largest && (
          <Result label="Largest |observed − reference|" value={`${c.largest.value.toFixed(4)} u`} testId="axis-largest"
            note={{ label: 'Largest mass-axis error |observed − reference|', value: c.largest.value, unit: 'u', origin: 'calculator', context: ctx }} />
        )}
        {fit && (
          <>
            <Result label="rms of the fit residuals" value={`${fit.rmsPpm.toFixed(2)} ppm`} testId="axis-rms"
              note={{ label: 'Mass-axis fit, rms residual', value: fit.rmsPpm, unit: 'ppm', origin: 'calculator', context: ctx }} />
            <Result label="Largest |residual| of the fit" value={`${fit.maxAbsPpm.toFixed(2)} ppm (${(largestResidualU ?? 0).toFixed(4)} u)`} testId="axis-max"
              note={{ label: 'Mass-axis fit, largest |residual|', value: fit.maxAbsPpm, unit: 'ppm', origin: 'calculator', context: ctx }} />
            <p class="hint" data-testid="axis-coefficients">
              Fit: reference = {signed(fit.coefficients.c0, 5)} u {signed(fit.coefficients.c1, 7)} × observed
              {fit.coefficients.c2 !== undefined && ` ${signed(fit.coefficients.c2, 10)} × observed² (per u)`}.
              {c.tolerance !== null && largestResidualU !== null && (largestResidualU <= c.tolerance
                ? ' A calibration with this fit would leave every ion inside the tolerance.'
                : ' Even this fit leaves an ion outside the tolerance: the error is not a plain offset or scale.')}
            </p>
            {chartData && (
              <Chart testId="axis-chart" label={`Residuals of the mass-axis fit in ppm against m/z, ${chartData[0].length} ions`} height={180} data={chartData}
                options={(pal) => ({
                  scales: { x: { time: false } },
                  axes: [{ label: 'm/z' }, { label: 'residual, ppm' }],
                  series: [{ label: 'm/z' }, { label: 'residual (ppm)', stroke: pal.teal, fill: undefined, paths: () => null, points: { show: true, size: 9, fill: pal.teal } }],
                  legend: { show: false },
                })} />
            )}
          </>
        )}
        {c.refusal && <p class="notice" role="status" data-testid="axis-refusal">{c.refusal}</p>}
        {!c.largest && !c.refusal && Object.keys(c.rowErrors).length === 0 && (
          <p class="muted" data-testid="axis-empty">Enter the observed m/z of each calibrant ion: tap the line of ions below.</p>
        )}
        {Object.keys(c.rowErrors).length > 0 && <p class="notice" role="status">Fix the marked rows below to see the fit.</p>}
      </div>
      <DraftProblem problem={draft.problem} />
      <InputsFold id="axis-fold" testId="axis-fold" summary={summary}
        invalid={Object.keys(c.rowErrors).length > 0 || !!c.chargeError || !!c.toleranceError}>
        <form class="card form" onSubmit={(e) => e.preventDefault()}>
          <h2 class="card-title">Calibrant ions</h2>
          {inputs.rows.map((row, i) => (
            <fieldset class="axis-row" key={i} data-testid="axis-row">
              <legend class="visually-hidden">Ion {i + 1}</legend>
              <div class="pair">
                <NumberField id={`axis-ref-${i}`} label={`Ion ${i + 1}: formula or reference m/z`} inputMode="text" value={row.reference}
                  error={c.rowErrors[i]?.reference} onInput={(t) => setRow(i, { reference: t })} />
                <NumberField id={`axis-obs-${i}`} label={`Ion ${i + 1}: observed m/z`} unit="u" value={row.observed}
                  error={c.rowErrors[i]?.observed} onInput={(t) => setRow(i, { observed: t })} />
              </div>
              <button type="button" class="btn btn-small" disabled={inputs.rows.length <= 1}
                onClick={() => void draft.update((cur) => ({ ...cur, rows: cur.rows.filter((_, j) => j !== i) }))}>Remove ion {i + 1}</button>
            </fieldset>
          ))}
          <button type="button" class="btn btn-small" disabled={inputs.rows.length >= MAX_ROWS}
            onClick={() => void draft.update((cur) => ({ ...cur, rows: [...cur.rows, { reference: '', observed: '' }] }))}>Add an ion</button>
          <div class="pair">
            <NumberField id="axis-charge" label="Charge of the formula ions" inputMode="text" value={inputs.charge} error={c.chargeError}
              hint="Whole number from −100 to 100, not 0." onInput={(t) => update({ charge: t })} />
            <SelectField id="axis-order" label="Fit" value={inputs.order} onChange={(v) => update({ order: v })}
              options={[{ value: '1', label: 'Straight line (order 1, 3 ions or more)' }, { value: '2', label: 'Quadratic (order 2, 4 ions or more)' }]} />
          </div>
          <NumberField id="axis-tolerance" label="Mass tolerance ±" unit="u" value={inputs.tolerance} error={c.toleranceError}
            hint="0.001 to 5 u. ±0.1 u is a common figure for a unit-resolution quadrupole (common practice); your method's or the maker's limit wins. Kept for this instrument."
            onInput={(t) => update({ tolerance: t })} />
        </form>
      </InputsFold>
      <More title="How the check works">
        <p>A formula is turned into its ion's monoisotopic m/z (electrons counted). The fit gives reference m/z from observed m/z; residuals are (reference − fitted)/reference × 10⁶ ppm. The verdict compares the largest error before any new calibration with the tolerance.</p>
        <p>Use ions spread over the working range; a quadratic needs one ion more than a line and bends to noise when the ions are few.</p>
      </More>
    </>
  );
}
