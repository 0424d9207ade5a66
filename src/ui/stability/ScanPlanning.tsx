// Scan planning: range, step, dwell and averaged scans → scan time and S/N gain (√N, counting statistics).
import { scanPlan } from '../../engine';
import type { InstrumentProfile } from '../../store';
import { NumberField } from '../components/Field';
import { formatNumber, formatSi } from '../format';
import { tryEngine, type FieldErrors } from '../bench/engineErrors';
import { parseNumber, usePersistentInputs } from '../bench/inputs';
import { Result } from '../bench/NoteButton';
import { DraftProblem } from '../components/DraftProblem';

type PlanInputs = { mzStart: string; mzEnd: string; step: string; dwell: string; settle: string; scans: string; countRate: string };
const planDefaults = (p: InstrumentProfile | null): PlanInputs =>
  p?.kind === 'rga'
    ? { mzStart: '1', mzEnd: '100', step: '1', dwell: '100', settle: '0', scans: '4', countRate: '' }
    : { mzStart: '50', mzEnd: '550', step: '0.1', dwell: '2', settle: '0', scans: '4', countRate: '' };

function duration(seconds: number): string {
  if (seconds < 1) return formatSi(seconds * 1e3, 'ms', 3);
  if (seconds < 120) return formatSi(seconds, 's', 3);
  if (seconds < 7200) return formatSi(seconds / 60, 'min', 3);
  return formatSi(seconds / 3600, 'h', 3);
}

export function ScanPlanning() {
  const [inputs, update, inputsProblem] = usePersistentInputs<PlanInputs>('scanplan', planDefaults);
  const errors: FieldErrors = {};
  const values: Record<string, number> = {};
  const labels: Record<keyof PlanInputs, [string, string]> = {
    mzStart: ['From m/z', '50'], mzEnd: ['To m/z', '550'], step: ['Step', '0.1'], dwell: ['Dwell per point', '2'],
    settle: ['Settling per point', '0'], scans: ['Scans averaged', '4'], countRate: ['Count rate at the peak', '10000'],
  };
  for (const key of Object.keys(labels) as (keyof PlanInputs)[]) {
    if (key === 'countRate' && inputs.countRate.trim() === '') continue;
    const r = parseNumber(inputs[key], labels[key][0], labels[key][1]);
    if (r.ok) values[key] = r.value;
    else errors[key] = r.message;
  }
  const ready = Object.keys(errors).length === 0;
  const plan = ready
    ? tryEngine(
        () => scanPlan({
          mzStart: values.mzStart, mzEnd: values.mzEnd, step: values.step, dwell: values.dwell / 1e3, settle: values.settle / 1e3,
          scans: values.scans, countRate: values.countRate,
        }),
        { mzStart: 'mzStart', mzEnd: 'mzEnd', step: 'step', dwell: 'dwell', settle: 'settle', scans: 'scans', countRate: 'countRate', points: 'step' },
        errors,
        'step',
      )
    : null;
  const field = (key: keyof PlanInputs, id: string, unit?: string) => (
    <NumberField id={id} inputMode={key === 'countRate' ? 'text' : 'decimal'} label={labels[key][0]} unit={unit} value={inputs[key]} error={errors[key]} onInput={(t) => update({ [key]: t } as Partial<PlanInputs>)} />
  );
  const ctx = { from: inputs.mzStart.trim(), to: inputs.mzEnd.trim(), step: inputs.step.trim(), dwellMs: inputs.dwell.trim(), scans: inputs.scans.trim() };
  return (
    <form class="card form" onSubmit={(e) => e.preventDefault()} aria-labelledby="plan-title">
      <h2 class="card-title" id="plan-title">Scan planning</h2>
      <DraftProblem problem={inputsProblem} />
      <div class="pair">
        {field('mzStart', 'plan-from', 'u')}
        {field('mzEnd', 'plan-to', 'u')}
        {field('step', 'plan-step', 'u')}
        {field('dwell', 'plan-dwell', 'ms')}
        {field('settle', 'plan-settle', 'ms')}
        {field('scans', 'plan-scans')}
      </div>
      {field('countRate', 'plan-rate', 'counts/s, optional')}
      {plan && (
        <div data-testid="scan-plan">
          <Result label="Points per scan" value={formatNumber(plan.points, 6)} note={{ label: 'Points per scan', value: plan.points, unit: '', origin: 'calculator', context: ctx }} />
          <Result label="Time per scan" value={duration(plan.timePerScan)} testId="plan-time-per-scan" note={{ label: 'Time per scan', value: plan.timePerScan, unit: 's', origin: 'calculator', context: ctx }} />
          <Result label="Total time, all scans" value={duration(plan.totalTime)} testId="plan-total" note={{ label: 'Total scan time', value: plan.totalTime, unit: 's', origin: 'calculator', context: ctx }} />
          <Result label="S/N gain over one scan" value={`× ${formatNumber(plan.signalToNoiseGain, 3)}`} testId="plan-gain" note={{ label: 'S/N gain from averaged scans', value: plan.signalToNoiseGain, unit: '', origin: 'calculator', context: ctx }} />
          {plan.countsPerPoint !== null && plan.relativeStandardDeviation !== null && (
            <Result label="Counts per point, and their scatter" value={`${formatNumber(plan.countsPerPoint, 4)} counts, RSD ${formatNumber(plan.relativeStandardDeviation * 100, 3)} %`}
              note={{ label: 'Relative standard deviation at the peak (counting statistics)', value: plan.relativeStandardDeviation * 100, unit: '%', origin: 'calculator', context: ctx }} />
          )}
          <p class="hint">Assumption: the noise is counting noise (Poisson), independent from scan to scan, so averaging N scans gains √N in S/N and the scatter of N counts is 1/√N (Knoll 2010). Drift, chemical background and electronic pick-up do not average away like this.</p>
        </div>
      )}
    </form>
  );
}
