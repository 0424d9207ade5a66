// The instrument's own limits (from its maker or the site), each with its source. A maker's limit wins over
// the generic ranges, and a reading outside it fails even when it is close to the baseline.
import { useEffect, useState } from 'preact/hooks';
import { formatNumber, fromBase, type InstrumentProfile, type MakerLimit, type MakerLimitDraft, type ReadingType } from '../../store';
import { useApp } from '../context';
import { errorText } from './files';

export function MakerLimits(props: { instrument: InstrumentProfile; types: ReadingType[] }) {
  const { store, notify } = useApp();
  const types = props.types.filter((t) => t.id !== 'noted-value');
  const [limits, setLimits] = useState<MakerLimit[]>([]);
  const [draft, setDraft] = useState<MakerLimitDraft>({ typeId: types[0]?.id ?? '', unitId: types[0]?.defaultUnit ?? '', low: '', high: '', source: '' });
  const [errors, setErrors] = useState<Partial<Record<keyof MakerLimitDraft, string>>>({});
  const [problem, setProblem] = useState<string | null>(null);

  const load = () => void store?.listMakerLimits(props.instrument.id).then(setLimits).catch((err) => setProblem(errorText(err)));
  useEffect(load, [store, props.instrument.id]);

  const type = types.find((t) => t.id === draft.typeId);
  const show = (l: MakerLimit) => {
    const t = types.find((x) => x.id === l.typeId);
    const u = t?.units.find((x) => x.id === t.defaultUnit);
    const f = (v: number) => (u ? `${formatNumber(fromBase(u, v))} ${u.label}` : formatNumber(v));
    const range = l.low !== undefined && l.high !== undefined ? `${f(l.low)} to ${f(l.high)}` : l.low !== undefined ? `at least ${f(l.low)}` : `at most ${f(l.high!)}`;
    return `${t?.label ?? l.typeId}: ${range}`;
  };

  async function save(e: Event) {
    e.preventDefault();
    if (!store) return;
    setProblem(null);
    try {
      const r = await store.saveMakerLimit(props.instrument.id, draft);
      if (!r.ok) { setErrors(r.errors); return; }
      setErrors({});
      setDraft((d) => ({ ...d, low: '', high: '', source: '' }));
      notify('Limit saved: new readings of this type are judged against it.');
      load();
    } catch (err) {
      setProblem(errorText(err));
    }
  }

  async function remove(typeId: string) {
    if (!store) return;
    try {
      await store.deleteMakerLimit(props.instrument.id, typeId);
      load();
    } catch (err) {
      setProblem(errorText(err));
    }
  }

  const field = (key: 'low' | 'high' | 'source', label: string, numeric: boolean) => (
    <div class={errors[key] ? 'field has-error' : 'field'}>
      <label for={`limit-${key}`}>{label}</label>
      <input id={`limit-${key}`} type="text" inputMode={numeric ? 'decimal' : 'text'} autoComplete="off" value={draft[key]}
        aria-invalid={errors[key] ? 'true' : 'false'} onInput={(e) => setDraft((d) => ({ ...d, [key]: (e.target as HTMLInputElement).value }))} />
      {errors[key] && <p class="field-error" role="alert">{errors[key]}</p>}
    </div>
  );

  return (
    <details class="card" data-testid="maker-limits">
      <summary>Maker’s limits for {props.instrument.name}: {limits.length === 0 ? 'none entered' : `${limits.length} entered`}</summary>
      <p class="muted">Where the instrument’s maker or your site sets a limit, enter it here with its source. It replaces the generic ranges; a reading outside it fails even when it is close to the baseline.</p>
      {limits.length > 0 && (
        <ul>
          {limits.map((l) => (
            <li key={l.typeId}>
              {show(l)} <span class="muted">— {l.source}</span>{' '}
              <button type="button" class="btn btn-small" onClick={() => remove(l.typeId)}>Remove</button>
            </li>
          ))}
        </ul>
      )}
      <form class="form" onSubmit={save} noValidate>
        <div class="field">
          <label for="limit-type">Reading</label>
          <select id="limit-type" value={draft.typeId} onChange={(e) => {
            const t = types.find((x) => x.id === (e.target as HTMLSelectElement).value)!;
            setDraft((d) => ({ ...d, typeId: t.id, unitId: t.defaultUnit }));
          }}>
            {types.map((t) => <option key={t.id} value={t.id}>{t.label}</option>)}
          </select>
        </div>
        <div class="field">
          <label for="limit-unit">Unit</label>
          <select id="limit-unit" value={draft.unitId} onChange={(e) => setDraft((d) => ({ ...d, unitId: (e.target as HTMLSelectElement).value }))}>
            {type?.units.map((u) => <option key={u.id} value={u.id}>{u.label}</option>)}
          </select>
        </div>
        {field('low', 'Lowest allowed (optional)', true)}
        {field('high', 'Highest allowed (optional)', true)}
        {field('source', 'Source (document, section, edition)', false)}
        {problem && <p class="banner banner-problem" role="alert">{problem}</p>}
        <div class="row"><button type="submit" class="btn">Save limit</button></div>
      </form>
    </details>
  );
}
