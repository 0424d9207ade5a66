// The instrument's own limits (from its maker or the site), each with its source. A maker's limit wins over
// the generic ranges, and a reading outside it fails even when it is close to the baseline.
import { useEffect, useState } from 'preact/hooks';
import { formatNumber, fromBase, limitMatchText, type InstrumentProfile, type MakerLimit, type MakerLimitDraft, type ReadingType } from '../../store';
import { useApp } from '../context';
import { useShownOnce } from '../components/Fold';
import { errorText } from '../errorText';

export function MakerLimits(props: { instrument: InstrumentProfile; types: ReadingType[] }) {
  const { store, notify } = useApp();
  // Earlier-design types are no longer entered, so a new limit for them would judge nothing.
  const types = props.types.filter((t) => t.id !== 'noted-value' && t.group !== 'earlier');
  const [limits, setLimits] = useState<MakerLimit[]>([]);
  const [draft, setDraft] = useState<MakerLimitDraft>({ typeId: types[0]?.id ?? '', unitId: types[0]?.defaultUnit ?? '', low: '', high: '', source: '' });
  const [errors, setErrors] = useState<Partial<Record<keyof MakerLimitDraft, string>>>({});
  const [problem, setProblem] = useState<string | null>(null);
  // The list and form are built when the card first opens (the summary already gives the count); kept after.
  const [shown, onToggle] = useShownOnce(false);

  const load = () => void store?.listMakerLimits(props.instrument.id).then(setLimits).catch((err) => setProblem(errorText(err)));
  useEffect(load, [store, props.instrument.id]);

  const type = types.find((t) => t.id === draft.typeId);
  const show = (l: MakerLimit) => {
    const t = types.find((x) => x.id === l.typeId);
    const u = t?.units.find((x) => x.id === t.defaultUnit);
    const f = (v: number) => (u ? `${formatNumber(fromBase(u, v))} ${u.label}` : formatNumber(v));
    const range = l.low !== undefined && l.high !== undefined ? `${f(l.low)} to ${f(l.high)}` : l.low !== undefined ? `at least ${f(l.low)}` : `at most ${f(l.high!)}`;
    const ions = limitMatchText(l);
    return `${t?.label ?? l.typeId}${ions ? ` (${ions})` : ''}: ${range}`;
  };

  async function save(e: Event) {
    e.preventDefault();
    if (!store) return;
    setProblem(null);
    try {
      const r = await store.saveMakerLimit(props.instrument.id, draft);
      if (!r.ok) { setErrors(r.errors); return; }
      setErrors({});
      setDraft((d) => ({ ...d, low: '', high: '', source: '', mz: '', referenceMz: '' }));
      notify('Limit saved: new readings of this type are judged against it.');
      load();
    } catch (err) {
      setProblem(errorText(err));
    }
  }

  async function remove(l: MakerLimit) {
    if (!store) return;
    try {
      await store.deleteMakerLimit(props.instrument.id, l.typeId, l.match);
      load();
    } catch (err) {
      setProblem(errorText(err));
    }
  }

  const field = (key: 'low' | 'high' | 'source' | 'mz' | 'referenceMz', label: string, numeric: boolean) => (
    <div class={errors[key] ? 'field has-error' : 'field'}>
      <label for={`limit-${key}`}>{label}</label>
      <input id={`limit-${key}`} type="text" inputMode={numeric ? 'decimal' : 'text'} autoComplete="off" value={draft[key] ?? ''}
        aria-invalid={errors[key] ? 'true' : 'false'} onInput={(e) => setDraft((d) => ({ ...d, [key]: (e.target as HTMLInputElement).value }))} />
      {errors[key] && <p class="field-error" role="alert">{errors[key]}</p>}
    </div>
  );

  return (
    <details class="card" data-testid="maker-limits" onToggle={onToggle}>
      <summary>Maker’s limits for {props.instrument.name}: {limits.length === 0 ? 'none entered' : `${limits.length} entered`}</summary>
      {shown && <>
      <p class="muted">Where the instrument’s maker or your site sets a limit, enter it here with its source. It replaces the generic ranges, and for the background-gas and calibrant checks it replaces the usual check; otherwise a reading outside it fails even when it is close to the baseline. Calibrant limits can be given for one ion pair.</p>
      {limits.length > 0 && (
        <ul>
          {limits.map((l) => (
            <li key={`${l.typeId}/${limitMatchText(l)}`}>
              {show(l)} <span class="muted">— {l.source}</span>{' '}
              <button type="button" class="btn btn-small" onClick={() => remove(l)}>Remove</button>
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
        {type?.matchContext.includes('mz') && field('mz', 'For ion m/z (optional: empty means every ion)', true)}
        {type?.matchContext.includes('referenceMz') && field('referenceMz', 'As % of m/z (optional)', true)}
        {field('low', 'Lowest allowed (optional)', true)}
        {field('high', 'Highest allowed (optional)', true)}
        {field('source', 'Source (document, section, edition)', false)}
        {problem && <p class="banner banner-problem" role="alert">{problem}</p>}
        <div class="row"><button type="submit" class="btn">Save limit</button></div>
      </form>
      </>}
      {!shown && problem && <p class="banner banner-problem" role="alert">{problem}</p>}
    </details>
  );
}
