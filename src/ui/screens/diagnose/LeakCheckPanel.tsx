import {
  DRY_AIR_PERCENT,
  DRY_AIR_SOURCE,
  fitOutgassing,
  leakIndication,
  rateOfRise,
  type LeakIndicationResult,
  type OutgassingFit,
  type PressureSample,
  type RateOfRiseResult,
} from '../../../engine';
import { checkTyped, errorWords, peakHeightSpec, specForUnit } from '../../../records';
import { NumberEntry } from '../../components/NumberEntry';
import { formatNumber } from '../../format';
import { SafetyCards } from './SafetyCards';

export type LeakTyped = Record<string, string>;

const INDICATION_WORDS: Record<LeakIndicationResult['indication'], string> = {
  'air-leak': 'Air leak',
  'water-after-venting': 'Water (normal for a few days after venting)',
  'carbon-dioxide': 'Carbon dioxide',
  'outgassing-or-co': 'CO or N2: outgassing, hot filament or a nitrogen source — not air',
  'not-air': 'Not air',
  'helium-tracer': 'Helium tracer seen: this joint leaks',
};

const PEAKS: Array<{ key: string; label: string; required?: boolean; tracer?: boolean }> = [
  { key: 'm18', label: 'm/z 18' },
  { key: 'm17', label: 'm/z 17' },
  { key: 'm28', label: 'm/z 28', required: true },
  { key: 'm32', label: 'm/z 32', required: true },
  { key: 'm40', label: 'm/z 40' },
  { key: 'm44', label: 'm/z 44' },
  { key: 'he0', label: 'm/z 4 before spraying', tracer: true },
  { key: 'm4', label: 'm/z 4 after the burst (helium tracer)', tracer: true },
];

function parseSeries(text: string, timeUnit: number, what: string): { ok: true; samples: PressureSample[] } | { ok: false; message: string } {
  const lines = text.split('\n').map((l) => l.trim()).filter(Boolean);
  const samples: PressureSample[] = [];
  for (const [i, line] of lines.entries()) {
    const parts = line.split(/[;\t ]+|,\s+/).filter(Boolean);
    if (parts.length !== 2) return { ok: false, message: `${what}, line ${i + 1}: write the time and the pressure separated by a space or semicolon.` };
    const t = checkTyped(parts[0], specForUnit(`${what}: time on line ${i + 1}`, timeUnit === 1 ? 's' : 'h'));
    if (!t.ok) return { ok: false, message: t.message };
    const p = checkTyped(parts[1], specForUnit(`${what}: pressure on line ${i + 1}`, 'mbar'));
    if (!p.ok) return { ok: false, message: p.message };
    samples.push({ t: t.value * timeUnit, p: p.value * 100 });
  }
  return { ok: true, samples };
}

function attempt<T>(fn: () => T): { ok: true; value: T } | { ok: false; message: string } {
  try {
    return { ok: true, value: fn() };
  } catch (err) {
    return { ok: false, message: errorWords(err) };
  }
}

/** Leak check: ratios from peak heights, rate of rise, and the outgassing-or-leak fit. Typed values live in the caller's draft. */
/** `onTyped` receives only the fields that changed; the owner merges them into its latest copy. */
export function LeakCheckPanel(props: { typed: LeakTyped; onTyped: (patch: LeakTyped) => void }) {
  const { typed, onTyped } = props;
  const set = (k: string) => (e: Event) => onTyped({ [k]: (e.target as HTMLInputElement | HTMLTextAreaElement).value });

  // Peak ratios.
  const peakErrors: Record<string, string> = {};
  const heights: Record<string, number> = {};
  for (const p of PEAKS) {
    const text = typed[p.key] ?? '';
    if (text.trim() === '') continue;
    const r = checkTyped(text, peakHeightSpec(`height at ${p.label}`));
    if (r.ok) heights[p.key] = r.value;
    else peakErrors[p.key] = r.message;
  }
  const canRatio = heights.m28 !== undefined && heights.m32 !== undefined && Object.keys(peakErrors).length === 0;
  const ratio = canRatio
    ? attempt(() =>
        leakIndication(
          { m28: heights.m28, m32: heights.m32, m4: heights.m4, m17: heights.m17, m18: heights.m18, m40: heights.m40, m44: heights.m44 },
          heights.he0,
        ),
      )
    : null;

  const peakField = (p: (typeof PEAKS)[number]) => (
    <NumberEntry key={p.key} id={`leak-${p.key}`} label={<>{p.label}{p.required ? '' : <span class="unit"> (optional)</span>}</>}
      spec={peakHeightSpec(`height at ${p.label}`)} value={typed[p.key] ?? ''} onInput={(t) => onTyped({ [p.key]: t })} />
  );

  // Rate of rise.
  const volumeSpec = specForUnit('isolated volume', 'L');
  const volume = (typed.volume ?? '').trim() ? checkTyped(typed.volume, volumeSpec) : null;
  const riseSeries = (typed.rise ?? '').trim() ? parseSeries(typed.rise, 1, 'Rate of rise') : null;
  let rise: { ok: true; value: RateOfRiseResult } | { ok: false; message: string } | null = null;
  if (volume && !volume.ok) rise = null; // the field says what is wrong
  else if (riseSeries && !riseSeries.ok) rise = riseSeries;
  else if (volume?.ok && riseSeries?.ok) rise = attempt(() => rateOfRise(volume.value * 1e-3, riseSeries.samples));

  // Outgassing fit.
  const pumpSeries = (typed.pump ?? '').trim() ? parseSeries(typed.pump, 3600, 'Pump-down') : null;
  let fit: { ok: true; value: OutgassingFit } | { ok: false; message: string } | null = null;
  if (pumpSeries && !pumpSeries.ok) fit = pumpSeries;
  else if (pumpSeries?.ok) fit = attempt(() => fitOutgassing(pumpSeries.samples));

  return (
    <section class="screen" aria-labelledby="leak-title">
      <h2 id="leak-title">Leak check</h2>
      <p class="lede">Heights from one background scan, a pressure-rise log, or a pump-down log. Nothing here leaves the device.</p>

      <div class="card">
        <h3 class="card-title">Peak ratios</h3>
        <p class="hint">Any one unit for all heights (counts/s, A, arbitrary). Dry air is N2 {DRY_AIR_PERCENT.nitrogen} %, O2 {DRY_AIR_PERCENT.oxygen} %, Ar {DRY_AIR_PERCENT.argon} % ({DRY_AIR_SOURCE}).</p>
        <div class="peak-grid">{PEAKS.filter((p) => !p.tracer).map(peakField)}</div>
        <h4 class="card-title" id="leak-tracer-title">Tracer at one joint (optional)</h4>
        <div data-testid="tracer-caution">
          <SafetyCards ids={['tracer', 'high-voltage']} open />
        </div>
        <ol class="hint" data-testid="tracer-steps" aria-labelledby="leak-tracer-title">
          <li>Read the card above first. Helium only where helium is not the carrier; argon (watch m/z 40) otherwise. Never a flammable tracer.</li>
          <li>Note m/z 4 before spraying.</li>
          <li>Spray one short burst at one joint reachable with covers on, away from live parts and HV feedthroughs; wait several seconds.</li>
          <li>Note m/z 4 again, and let the signal clear before the next joint.</li>
        </ol>
        <div class="peak-grid">{PEAKS.filter((p) => p.tracer).map(peakField)}</div>
        {!canRatio && Object.keys(peakErrors).length === 0 && <p class="hint">Enter at least m/z 28 and 32.</p>}
        {Object.keys(peakErrors).length > 0 && <p class="hint" data-testid="leak-heights-refused">No ratios until the heights marked above are fixed.</p>}
        {ratio && !ratio.ok && <p class="field-error" role="alert">{ratio.message}</p>}
        {ratio?.ok && (
          <div data-testid="leak-indication">
            <p class="big">{INDICATION_WORDS[ratio.value.indication]}</p>
            <ul>{ratio.value.reasons.map((r) => <li key={r}>{r}</li>)}</ul>
            <div class="scroll-x">
              <table class="values stack-table">
                <thead><tr><th>Ratio</th><th>Measured</th><th>Band</th><th>In band</th><th>Source</th></tr></thead>
                <tbody>
                  {ratio.value.ratios.map((r) => (
                    <tr key={r.name}>
                      <td class="stack-head">{r.name}</td>
                      <td data-label="Measured">{r.measured === null ? 'cannot form (zero denominator)' : formatNumber(r.measured)}</td>
                      <td data-label="Band">{formatNumber(r.low)} to {Number.isFinite(r.high) ? formatNumber(r.high) : 'any higher'}</td>
                      <td class="stack-side">{r.inBand ? '✓ in band' : '✗ outside'}</td>
                      <td class="hint" data-label="Source">{r.source}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </div>
        )}
      </div>

      <div class="card">
        <h3 class="card-title">Rate of rise</h3>
        <p class="hint">Isolate the volume, then log time (s) and pressure (mbar), one pair per line. Q = V·Δp/Δt (O'Hanlon, A User's Guide to Vacuum Technology, 3rd ed., 2003).</p>
        <NumberEntry id="leak-volume" label={<>Isolated volume<span class="unit"> (L)</span></>} spec={volumeSpec}
          value={typed.volume ?? ''} onInput={(t) => onTyped({ volume: t })} />
        <div class="field">
          <label for="leak-rise">Time (s) and pressure (mbar)</label>
          <textarea id="leak-rise" rows={5} value={typed.rise ?? ''} onInput={set('rise')} placeholder={'0 1e-3\n60 1.6e-3\n120 2.2e-3'} />
        </div>
        {rise && !rise.ok && <p class="field-error" role="alert">{rise.message}</p>}
        {rise?.ok && (
          <div data-testid="rate-of-rise">
            <p class="big">Q = {formatNumber(rise.value.throughput * 10, 3)} mbar·L/s</p>
            <p>{rise.value.reason}{rise.value.slopeRatio !== null ? ` (late/early slope ${formatNumber(rise.value.slopeRatio, 3)})` : ''}</p>
          </div>
        )}
      </div>

      <div class="card">
        <h3 class="card-title">Outgassing or leak?</h3>
        <p class="hint">Time since pump-down started (h) and pressure (mbar), one pair per line. Fits p = A/t + B: water falls as 1/t, a leak leaves the floor B.</p>
        <div class="field">
          <label for="leak-pump">Time (h) and pressure (mbar)</label>
          <textarea id="leak-pump" rows={5} value={typed.pump ?? ''} onInput={set('pump')} placeholder={'1 8e-5\n4 2.4e-5\n24 6e-6'} />
        </div>
        {fit && !fit.ok && <p class="field-error" role="alert">{fit.message}</p>}
        {fit?.ok && (
          <div data-testid="outgassing-fit">
            <p class="big">Floor B = {formatNumber(fit.value.B / 100, 3)} mbar</p>
            <p>{fit.value.reason}</p>
            <p class="hint">A = {formatNumber(fit.value.A / 100 / 3600, 3)} mbar·h; R² = {formatNumber(fit.value.rSquared, 4)}; floor share at the last point {formatNumber(fit.value.floorShareAtEnd * 100, 3)} %.</p>
          </div>
        )}
      </div>
    </section>
  );
}
