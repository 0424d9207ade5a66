// Correcting a recorded reading: value, unit and note; the version replaced stays in the reading's history.
import { useState } from 'preact/hooks';
import { checkTyped, toBase, typeSpec, type Reading, type ReadingType } from '../../records';
import { NumberEntry } from '../components/NumberEntry';
import { useApp } from '../context';
import { errorText } from '../errorText';

export function ReadingEdit(props: { reading: Reading; type: ReadingType; onDone: (saved: boolean) => void }) {
  const { store, notify } = useApp();
  const { reading: r, type } = props;
  const startUnit = type.units.find((u) => u.label === r.entered.unit) ?? type.units.find((u) => u.id === type.defaultUnit) ?? type.units[0];
  const [text, setText] = useState(r.entered.text);
  const [unitId, setUnitId] = useState(startUnit.id);
  const [note, setNote] = useState(r.note);
  const [tried, setTried] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const unit = type.units.find((u) => u.id === unitId) ?? startUnit;
  const spec = typeSpec(type, unit);
  const idBase = `edit-${r.id}`;

  async function save() {
    const c = checkTyped(text, spec);
    if (!c.ok) { setTried(true); return; }
    if (!store) { setProblem('The database is not open, so the change cannot be saved yet. Your input stays here.'); return; }
    try {
      const context = { ...(r.context ?? {}) };
      if (type.units.length > 1) context.convention = unit.label;
      await store.updateReading(r.id, { value: toBase(unit, c.value), entered: { text: text.trim(), unit: unit.label }, context, note });
      notify(`Changed: ${type.label}. The earlier value is kept in its history.`);
      props.onDone(true);
    } catch (err) {
      setProblem(`${errorText(err)} Your input stays here.`);
    }
  }

  return (
    <div class="reading-edit" data-testid="reading-edit">
      <div class="row">
        <NumberEntry id={`${idBase}-value`} label="Corrected value" spec={spec} value={text} showError={tried} onInput={(t) => { setTried(false); setText(t); }} />
        {type.units.length > 1 && (
          <div class="field">
            <label for={`${idBase}-unit`}>Unit</label>
            <select id={`${idBase}-unit`} value={unitId} onChange={(e) => setUnitId((e.target as HTMLSelectElement).value)}>
              {type.units.map((u) => <option key={u.id} value={u.id}>{u.label}</option>)}
            </select>
          </div>
        )}
      </div>
      <div class="field">
        <label for={`${idBase}-note`}>Note (say why it changed)</label>
        <textarea id={`${idBase}-note`} rows={2} value={note} onInput={(e) => setNote((e.target as HTMLTextAreaElement).value)} />
      </div>
      {problem && <p class="banner banner-problem" role="alert">{problem}</p>}
      <div class="row">
        <button type="button" class="btn btn-primary" onClick={() => void save()}>Save the change</button>
        <button type="button" class="btn" onClick={() => props.onDone(false)}>Cancel</button>
      </div>
    </div>
  );
}
