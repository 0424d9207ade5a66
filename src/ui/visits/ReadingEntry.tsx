// Reading entry: pick a type from the catalogue, type the value in the unit shown on the instrument, see the
// expected value and the verdict before saving. The form is a draft from the first keystroke.
import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import {
  checkEntry, formatNumber, fromBase, parseNumber, toBase, verdictWords, type Expectation, type InstrumentProfile, type Judgement,
  type ReadingType, type Visit,
} from '../../store';
import { probeConventionFrom, probeConventionKey, rfUnitId, typeSpec } from '../../records';
import { NumberEntry } from '../components/NumberEntry';
import { RF_FORMS } from '../../engine';
import { useApp } from '../context';
import { markSaved, markUnsaved } from '../offline';
import { errorText } from './files';

const RF_FORM_BY_UNIT = new Map(RF_FORMS.map((f) => [rfUnitId(f), f]));

interface ReadingDraft {
  typeId: string;
  phase: 'as-found' | 'as-left';
  text: string;
  unitId: string;
  context: Record<string, string>;
  note: string;
}

const groups: [ReadingType['group'], string][] = [
  ['vacuum', 'Vacuum'], ['source', 'Ion source'], ['analyser', 'Analyser'], ['detector', 'Detector'],
  ['performance', 'Performance'], ['leak-check', 'Leak check'], ['own', 'Your own'],
];

/** The unit matching how this instrument states RF (its read-back convention), else the type's default. */
function preferredUnit(type: ReadingType, instrument: InstrumentProfile | null, remembered?: string): string {
  if (type.id === 'rf-amplitude' && remembered && type.units.some((u) => u.id === remembered)) return remembered;
  if (type.id === 'rf-amplitude' && instrument) {
    const c = instrument.readbackConvention;
    const form = c.amplitude === 'zero-to-peak' ? 'V0p' : c.amplitude === 'peak-to-peak' ? 'Vpp' : 'Vrms';
    const id = `${form}-${c.reference === 'per-rod' ? 'rod' : 'pairs'}`;
    if (type.units.some((u) => u.id === id)) return id;
  }
  if (type.id === 'dc-amplitude' && instrument?.readbackConvention.reference === 'between-pairs') return 'V-pairs';
  return type.defaultUnit;
}

function blank(type: ReadingType, instrument: InstrumentProfile | null, phase: ReadingDraft['phase'] = 'as-found', remembered?: string): ReadingDraft {
  const context: Record<string, string> = {};
  for (const f of type.context) if (f.defaultValue !== undefined) context[f.key] = String(f.defaultValue);
  return { typeId: type.id, phase, text: '', unitId: preferredUnit(type, instrument, remembered), context, note: '' };
}

export function ReadingEntry(props: { visit: Visit; types: ReadingType[]; onSaved: () => void }) {
  const { store, instrument, notify } = useApp();
  const { visit, types } = props;
  const draftKey = `reading-form:${visit.id}`;
  const choosable = useMemo(() => types.filter((t) => t.id !== 'noted-value'), [types]);
  const [draft, setDraft] = useState<ReadingDraft | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [preview, setPreview] = useState<{ expectation?: Expectation; judgement?: Judgement } | null>(null);
  const [busy, setBusy] = useState(false);
  const latest = useRef<ReadingDraft | null>(null);
  latest.current = draft;
  // The RF convention this engineer reads this instrument in (remembered per instrument, shared with the walk).
  const [remembered, setRemembered] = useState<string | undefined>(undefined);
  useEffect(() => {
    if (!store || !instrument) return;
    void store.getSetting<unknown>(probeConventionKey(instrument.id)).then((v) => {
      const f = probeConventionFrom(v);
      if (f) setRemembered(rfUnitId(f));
    }).catch((err: unknown) => notify(`The remembered probe convention could not be read (${errorText(err)}).`));
  }, [store, instrument, notify]);

  useEffect(() => {
    if (!store || draft || choosable.length === 0) return;
    void store.getDraft<ReadingDraft>(draftKey).then((kept) => {
      if (kept && choosable.some((t) => t.id === kept.typeId)) {
        setDraft(kept);
        if (kept.text || kept.note) markUnsaved(draftKey, 'a reading being entered');
      } else setDraft(blank(choosable[0], instrument));
    }).catch(() => setDraft(blank(choosable[0], instrument)));
  }, [store, draft, draftKey, choosable, instrument]);

  useEffect(() => () => markSaved(draftKey), [draftKey]);

  const type = draft ? choosable.find((t) => t.id === draft.typeId) ?? choosable[0] : undefined;
  const unit = type && draft ? type.units.find((u) => u.id === draft.unitId) ?? type.units[0] : undefined;

  // Live expected value and verdict for what is typed so far.
  useEffect(() => {
    if (!store || !draft || !type) return;
    const r = checkEntry(type, draft.text, draft.unitId, draft.context);
    if (!r.ok) { setPreview(null); return; }
    let stale = false;
    void store.previewReading(visit.id, type.id, r.value, r.context).then((p) => { if (!stale) setPreview(p); }).catch(() => setPreview(null));
    return () => { stale = true; };
  }, [store, draft, type, visit.id]);

  if (!draft || !type || !unit) return <p>Loading the readings catalogue…</p>;

  function update(patch: Partial<ReadingDraft>) {
    const next = { ...latest.current!, ...patch };
    latest.current = next;
    setDraft(next);
    markUnsaved(draftKey, 'a reading being entered');
    if (Object.keys(errors).length) {
      const t = choosable.find((x) => x.id === next.typeId)!;
      const r = checkEntry(t, next.text, next.unitId, next.context);
      setErrors(r.ok ? {} : Object.fromEntries(Object.entries(r.errors).filter(([k]) => k in errors)));
    }
    void store?.putDraft(draftKey, next).catch(() => undefined);
  }

  function chooseType(id: string) {
    const t = choosable.find((x) => x.id === id)!;
    setErrors({});
    update({ ...blank(t, instrument, latest.current!.phase, remembered), note: latest.current!.note });
  }

  function chooseUnit(id: string) {
    // Keep the quantity, not the digits: 1.2e-5 Torr becomes 1.6e-5 mbar.
    const old = unit!;
    const next = type!.units.find((u) => u.id === id)!;
    const typed = parseNumber(latest.current!.text);
    const text = typed === null ? latest.current!.text : formatNumber(fromBase(next, toBase(old, typed)), 6);
    update({ unitId: id, text });
    if (type!.id === 'rf-amplitude' && store && instrument) {
      const form = RF_FORM_BY_UNIT.get(id);
      if (form) {
        setRemembered(id);
        void store.setSetting(probeConventionKey(instrument.id), form)
          .catch((err: unknown) => notify(`The probe convention could not be remembered (${errorText(err)}).`));
      }
    }
  }

  async function save(e: Event) {
    e.preventDefault();
    setProblem(null);
    const d = latest.current!;
    const r = checkEntry(type!, d.text, d.unitId, d.context);
    if (!r.ok) {
      setErrors(r.errors);
      document.getElementById(`reading-${Object.keys(r.errors)[0]}`)?.focus();
      return;
    }
    if (!store) { setProblem('The database is not open, so the reading cannot be saved yet. Your input stays here.'); return; }
    setBusy(true);
    try {
      const saved = await store.addReading({
        visitId: visit.id, typeId: type!.id, phase: d.phase, value: r.value, entered: { text: d.text.trim(), unit: unit!.label },
        context: r.context, note: d.note,
      });
      const next = { ...blank(type!, instrument, d.phase, remembered) };
      // Keep context that usually repeats (gauge gas, reference ion), clear the value and note.
      next.context = { ...d.context };
      latest.current = next;
      setDraft(next);
      await store.putDraft(draftKey, next).catch(() => undefined);
      markSaved(draftKey);
      setErrors({});
      notify(`Saved: ${type!.label}, ${saved.verdict ? `${verdictWords[saved.verdict].symbol} ${verdictWords[saved.verdict].word}` : 'not judged'}.`);
      props.onSaved();
      document.getElementById('reading-value')?.focus();
    } catch (err) {
      setProblem(`${errorText(err)} Your input stays here.`);
    } finally {
      setBusy(false);
    }
  }

  const e = preview?.expectation;
  const shownExpected = e && (e.value !== undefined
    ? `${formatNumber(fromBase(unit, e.value))} ${unit.label}`
    : `${e.low !== undefined ? formatNumber(fromBase(unit, e.low)) : '…'} to ${e.high !== undefined ? formatNumber(fromBase(unit, e.high)) : '…'} ${unit.label}`);

  return (
    <form class="form card" onSubmit={save} noValidate data-testid="reading-form">
      <h2 class="card-title">Add a reading</h2>
      <div class="field">
        <label for="reading-type">Reading</label>
        <select id="reading-type" value={type.id} onChange={(ev) => chooseType((ev.target as HTMLSelectElement).value)}>
          {groups.map(([g, label]) => {
            const list = choosable.filter((t) => t.group === g);
            return list.length ? (
              <optgroup key={g} label={label}>
                {list.map((t) => <option key={t.id} value={t.id}>{t.label}</option>)}
              </optgroup>
            ) : null;
          })}
        </select>
        <p class="hint">{type.help}</p>
      </div>
      <fieldset class="phase-choice" aria-label="Phase">
        {(['as-found', 'as-left'] as const).map((p) => (
          <label key={p}>
            <input type="radio" name="reading-phase" value={p} checked={draft.phase === p} onChange={() => update({ phase: p })} />
            {p === 'as-found' ? 'As found' : 'As left'}
          </label>
        ))}
      </fieldset>
      <div class="row" style={undefined}>
        <div style={{ flex: '1 1 10rem' }}>
          <NumberEntry id="reading-value" label="Value" spec={typeSpec(type, unit)} value={draft.text} showError={!!errors.value}
            onInput={(t) => update({ text: t })} />
        </div>
        <div class="field" style={{ flex: '1 1 12rem' }}>
          <label for="reading-unit">Unit</label>
          <select id="reading-unit" value={unit.id} onChange={(ev) => chooseUnit((ev.target as HTMLSelectElement).value)}>
            {type.units.map((u) => <option key={u.id} value={u.id}>{u.label}</option>)}
          </select>
        </div>
      </div>
      {type.context.map((f) => (
        <div key={f.key} class={errors[f.key] ? 'field has-error' : 'field'}>
          <label for={`reading-${f.key}`}>
            {f.label}{f.key === 'setpoint' ? <span class="unit"> ({unit.label})</span> : f.unit ? <span class="unit"> ({f.unit})</span> : null}
          </label>
          {f.kind === 'choice' ? (
            <select id={`reading-${f.key}`} value={draft.context[f.key] ?? ''} onChange={(ev) => update({ context: { ...latest.current!.context, [f.key]: (ev.target as HTMLSelectElement).value } })}>
              {f.choices!.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
            </select>
          ) : (
            <input id={`reading-${f.key}`} type="text" inputMode={f.kind === 'number' ? 'decimal' : 'text'} autoComplete="off"
              value={draft.context[f.key] ?? ''} aria-invalid={errors[f.key] ? 'true' : 'false'}
              onInput={(ev) => update({ context: { ...latest.current!.context, [f.key]: (ev.target as HTMLInputElement).value } })} />
          )}
          {f.help && <p class="hint">{f.help}</p>}
          {errors[f.key] && <p class="field-error" role="alert">{errors[f.key]}</p>}
        </div>
      ))}
      <div class="field">
        <label for="reading-note">Note</label>
        <textarea id="reading-note" rows={2} value={draft.note} onInput={(ev) => update({ note: (ev.target as HTMLTextAreaElement).value })} />
      </div>
      <div class="expect-box" aria-live="polite" data-testid="reading-preview">
        {e && preview?.judgement ? (
          <>
            <p class="expect-big" data-testid="reading-expected">Expected: {shownExpected}</p>
            <p>From {e.basis === 'generic' ? 'a generic range' : e.basis === 'maker limit' ? 'the maker’s limit' : e.basis === 'set value' ? 'the set value' : `the ${e.basis} value`}</p>
            <p class="hint">{e.source}</p>
            <p>Verdict if saved: <span class={`verdict verdict-${preview.judgement.verdict}`}>{verdictWords[preview.judgement.verdict].symbol} {verdictWords[preview.judgement.verdict].word}</span> ({preview.judgement.summary})</p>
          </>
        ) : draft.text.trim() === '' ? (
          <p class="hint">Type a value to see what it is judged against.</p>
        ) : (
          <p class="hint">No expected value for this reading yet (no baseline, calculation or generic range). It will be recorded without a verdict.</p>
        )}
      </div>
      {problem && <p class="banner banner-problem" role="alert">{problem}</p>}
      <div class="row">
        <button type="submit" class="btn btn-primary" disabled={busy}>Save reading</button>
      </div>
    </form>
  );
}
