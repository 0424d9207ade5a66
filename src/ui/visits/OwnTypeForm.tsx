// Add a reading type of your own (kept on this device, included in backups).
import { useState } from 'preact/hooks';
import { emptyOwnTypeDraft, type OwnTypeDraft, type ReadingType } from '../../store';
import { useApp } from '../context';
import { Disclosure } from '../components/Fold';
import { errorText } from '../errorText';

const fields: { key: keyof OwnTypeDraft; label: string; hint?: string; numeric?: boolean }[] = [
  { key: 'label', label: 'Name', hint: 'For example “Chiller water flow”.' },
  { key: 'unit', label: 'Unit', hint: 'As you will type values, for example “L/min”.' },
  { key: 'min', label: 'Lowest plausible value', hint: 'Anything below is refused as a typing slip.', numeric: true },
  { key: 'max', label: 'Highest plausible value', numeric: true },
  { key: 'expectedLow', label: 'Expected range, low end (optional)', numeric: true },
  { key: 'expectedHigh', label: 'Expected range, high end (optional)', numeric: true },
  { key: 'source', label: 'Where the expected range comes from', hint: 'For example the maker’s limit, or “site practice”.' },
  { key: 'pass', label: 'Pass within', numeric: true },
  { key: 'borderline', label: 'Borderline within', numeric: true },
];

export function OwnTypeForm(props: { onAdded: (t: ReadingType) => void }) {
  const { store, notify } = useApp();
  const [draft, setDraft] = useState<OwnTypeDraft>(emptyOwnTypeDraft());
  const [errors, setErrors] = useState<Partial<Record<keyof OwnTypeDraft, string>>>({});
  const [problem, setProblem] = useState<string | null>(null);

  async function save(e: Event) {
    e.preventDefault();
    if (!store) return;
    setProblem(null);
    try {
      const r = await store.saveOwnReadingType(draft);
      if (!r.ok) { setErrors(r.errors); return; }
      setErrors({});
      setDraft(emptyOwnTypeDraft());
      notify(`Added the reading type “${r.type.label}”.`);
      props.onAdded(r.type);
    } catch (err) {
      setProblem(errorText(err));
    }
  }

  const unitWord = draft.toleranceKind === 'relative' ? '%' : draft.unit || 'units';
  // The form is built when the card first opens (and kept, with what was typed, when it closes again).
  return (
    <Disclosure class="card" testId="own-type" summary="Add a reading type of your own">
      <form class="form" onSubmit={save} noValidate>
        <p class="muted">Judged against the instrument’s baseline once one exists, otherwise against the expected range below.</p>
        {fields.map((f) => (
          <div key={f.key} class={errors[f.key] ? 'field has-error' : 'field'}>
            <label for={`own-${f.key}`}>{f.label}{(f.key === 'pass' || f.key === 'borderline') && <span class="unit"> ({unitWord})</span>}</label>
            <input id={`own-${f.key}`} type="text" inputMode={f.numeric ? 'decimal' : 'text'} autoComplete="off" value={draft[f.key]}
              aria-invalid={errors[f.key] ? 'true' : 'false'} onInput={(e) => setDraft((d) => ({ ...d, [f.key]: (e.target as HTMLInputElement).value }))} />
            {f.hint && <p class="hint">{f.hint}</p>}
            {errors[f.key] && <p class="field-error" role="alert">{errors[f.key]}</p>}
          </div>
        ))}
        <div class="field">
          <label for="own-toleranceKind">Tolerance is</label>
          <select id="own-toleranceKind" value={draft.toleranceKind} onChange={(e) => setDraft((d) => ({ ...d, toleranceKind: (e.target as HTMLSelectElement).value }))}>
            <option value="relative">a percentage of the expected value</option>
            <option value="absolute">an amount in the reading’s unit</option>
          </select>
        </div>
        <div class="field">
          <label for="own-badSide">Which way is bad</label>
          <select id="own-badSide" value={draft.badSide} onChange={(e) => setDraft((d) => ({ ...d, badSide: (e.target as HTMLSelectElement).value }))}>
            <option value="both">too high or too low</option>
            <option value="high">only too high</option>
            <option value="low">only too low</option>
          </select>
        </div>
        {problem && <p class="banner banner-problem" role="alert">{problem}</p>}
        <div class="row"><button type="submit" class="btn">Add reading type</button></div>
      </form>
    </Disclosure>
  );
}
