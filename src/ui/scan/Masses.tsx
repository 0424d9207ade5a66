// Masses: a formula and a charge give the monoisotopic mass, the ion's m/z and the isotope pattern (table and a
// small bar chart). A formula the parser refuses is named with the position and the reason it gives.
import { ionMz, isotopePattern, monoisotopicMass, type IsotopePeak } from '../../spectrum';
import { NumberField } from '../components/Field';
import { InputsFold } from '../components/Fold';
import { DraftProblem } from '../components/DraftProblem';
import { formatNumber } from '../format';
import { Result } from '../bench/NoteButton';
import { usePersistentInputs } from '../bench/inputs';
import { readCharge } from './read';

/** A spectrum-module message as a sentence that names the field. */
function sentence(message: string): string {
  const m = message.startsWith('Formula') || message.startsWith('Element') ? message : `Formula: ${message}`;
  return /[.!?]$/.test(m) ? m : `${m}.`;
}

export interface MassesInputs extends Record<string, string> {
  formula: string;
  charge: string;
}

export const massesDefaults = (): MassesInputs => ({ formula: 'C4F9', charge: '1' });

export interface MassesAnswer {
  mass: number;
  mz: number;
  charge: number;
  pattern: IsotopePeak[];
}

/** The answer for a formula and a charge, or one message per bad field. */
export function massesFor(inputs: MassesInputs): { ok: true; answer: MassesAnswer } | { ok: false; errors: { formula?: string; charge?: string } } {
  const errors: { formula?: string; charge?: string } = {};
  const charge = readCharge(inputs.charge, 'Charge');
  if (!charge.ok) errors.charge = charge.message;
  let mass = NaN;
  if (inputs.formula.trim() === '') errors.formula = 'Formula: enter an elemental formula, e.g. C4F9 or C9F20N.';
  else {
    try {
      mass = monoisotopicMass(inputs.formula);
    } catch (err) {
      errors.formula = sentence((err as Error).message);
    }
  }
  if (!charge.ok || errors.formula) return { ok: false, errors };
  try {
    const mz = ionMz(inputs.formula, charge.value);
    const pattern = isotopePattern(inputs.formula, { charge: charge.value });
    if (!Number.isFinite(mz) || !Number.isFinite(mass)) return { ok: false, errors: { formula: 'Formula: the mass could not be computed.' } };
    return { ok: true, answer: { mass, mz, charge: charge.value, pattern } };
  } catch (err) {
    return { ok: false, errors: { formula: sentence((err as Error).message) } };
  }
}

/** Abundances as bars, tallest 100 %. Plain boxes: a handful of bars need no plotting library. */
export function IsotopeBars(props: { pattern: IsotopePeak[]; label: string; testId?: string }) {
  const top = Math.max(...props.pattern.map((p) => p.abundance), 0);
  if (!(top > 0)) return null;
  return (
    <div class="iso-bars" role="img" aria-label={props.label} data-testid={props.testId}>
      {props.pattern.map((p) => (
        <div class="iso-bar" key={p.mz}>
          <span class="iso-bar-fill" style={{ height: `${Math.max(1, (100 * p.abundance) / top)}%` }} />
          <span class="iso-bar-label">{formatNumber(p.mz, 4)}</span>
        </div>
      ))}
    </div>
  );
}

export function IsotopeTable(props: { pattern: IsotopePeak[] }) {
  const top = Math.max(...props.pattern.map((p) => p.abundance), 0);
  return (
    <table class="values" data-testid="isotope-table">
      <thead>
        <tr><th scope="col">m/z</th><th scope="col">Relative height (tallest 100 %)</th></tr>
      </thead>
      <tbody>
        {props.pattern.map((p) => (
          <tr key={p.mz}>
            <td>{p.mz.toFixed(4)}</td>
            <td>{top > 0 ? ((100 * p.abundance) / top).toFixed(2) : '—'} %</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function Masses() {
  const [inputs, update, problem] = usePersistentInputs<MassesInputs>('masses', massesDefaults);
  const r = massesFor(inputs);
  const errors = r.ok ? {} : r.errors;
  const ctx: Record<string, string | number> = r.ok ? { formula: inputs.formula.trim(), charge: r.answer.charge } : {};
  return (
    <>
      {r.ok ? (
        <div class="card answer" data-testid="masses-answer">
          <Result label={`Ion m/z (charge ${r.answer.charge > 0 ? '+' : ''}${r.answer.charge})`} value={`${r.answer.mz.toFixed(5)}`} testId="masses-mz"
            note={{ label: `Ion m/z of ${inputs.formula.trim()}`, value: r.answer.mz, unit: 'u', origin: 'calculator', context: ctx }} />
          <Result label="Monoisotopic mass (neutral)" value={`${r.answer.mass.toFixed(5)} u`} testId="masses-mass"
            note={{ label: `Monoisotopic mass of ${inputs.formula.trim()}`, value: r.answer.mass, unit: 'u', origin: 'calculator', context: ctx }} />
          <IsotopeBars pattern={r.answer.pattern} label={`Isotope pattern of ${inputs.formula.trim()}: ${r.answer.pattern.length} peaks`} testId="masses-bars" />
          <IsotopeTable pattern={r.answer.pattern} />
          <p class="hint">Masses of the isotopes AME2016; abundances are IUPAC representative compositions; electron mass CODATA 2018. The ion's m/z counts the electrons taken or added.</p>
        </div>
      ) : (
        <p class="notice" role="alert" data-testid="masses-problem">{errors.formula ?? errors.charge}</p>
      )}
      <DraftProblem problem={problem} />
      <InputsFold id="masses-fold" testId="masses-fold" invalid={!r.ok} summary={`${inputs.formula.trim() || '—'} · charge ${inputs.charge.trim() || '—'}`}>
        <form class="card form" onSubmit={(e) => e.preventDefault()}>
          <NumberField id="masses-formula" label="Formula" inputMode="text" value={inputs.formula} error={errors.formula}
            hint="Element symbols with counts; parentheses allowed, e.g. C4F9, (CF3)3N, C9F20N." onInput={(t) => update({ formula: t })} />
          <NumberField id="masses-charge" label="Charge" inputMode="text" value={inputs.charge} error={errors.charge}
            hint="Whole number from −100 to 100, not 0; negative for anions." onInput={(t) => update({ charge: t })} />
        </form>
      </InputsFold>
    </>
  );
}
