// Reading entry: pick a type from the catalogue, type the value in the unit shown on the instrument, see the
// expected value and the verdict before saving. The form is a draft from the first keystroke.
import { useEffect, useMemo, useState } from 'preact/hooks';
import {
  calibrantChoices, CALIBRANT_ISOTOPE_TYPE, CALIBRANT_RATIO_TYPE, checkEntry, EARLIER_DESIGN_SUCCESSOR, formatNumber, fromBase, parseNumber, toBase, verdictWords,
  type CalibrantChoice, type Expectation, type InstrumentProfile, type Judgement, type Reading, type ReadingType, type Visit,
} from '../../store';
import { probeConventionFrom, probeConventionKey, rfUnitId, typeSpec } from '../../records';
import { NumberEntry } from '../components/NumberEntry';
import { RF_FORMS } from '../../engine';
import { useApp } from '../context';
import { DraftProblem } from '../components/DraftProblem';
import { useDraft } from '../components/useDraft';
import { errorText } from '../errorText';

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
  ['performance', 'Performance and calibrant'], ['leak-check', 'Background gas'], ['own', 'Your own'],
];

/** Types whose ions the engineer chooses for the instrument: the entry offers the ions chosen so far. */
const calibrantTypes = new Set([CALIBRANT_RATIO_TYPE, CALIBRANT_ISOTOPE_TYPE, 'peak-width']);

function choiceText(c: CalibrantChoice, typeId: string): string {
  if (typeId === CALIBRANT_RATIO_TYPE) return `m/z ${c.mz} as % of m/z ${c.referenceMz}`;
  return `m/z ${c.mz}${typeId === CALIBRANT_ISOTOPE_TYPE && c.formula ? ` (${c.formula})` : ''}`;
}

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
  // Earlier-design types stay readable but are not offered for new readings.
  const choosable = useMemo(() => types.filter((t) => t.id !== 'noted-value' && t.group !== 'earlier'), [types]);
  const [instrumentReadings, setInstrumentReadings] = useState<Reading[] | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [preview, setPreview] = useState<{ expectation?: Expectation; judgement?: Judgement } | null>(null);
  const [busy, setBusy] = useState(false);
  const kept = useDraft<ReadingDraft>({
    key: draftKey,
    what: 'a reading being entered',
    ready: choosable.length > 0,
    initial: () => blank(choosable[0], instrument),
    // A form left unsaved on an earlier-design type carries over to its successor, with what was typed.
    revive: (d) => {
      const successor = EARLIER_DESIGN_SUCCESSOR[d.typeId];
      return successor ? { ...d, typeId: successor, unitId: choosable.find((t) => t.id === successor)?.defaultUnit ?? d.unitId } : d;
    },
    accept: (d) => choosable.some((t) => t.id === d.typeId),
    unsavedWhenRestored: (d) => Boolean(d.text || d.note),
  });
  const draft = kept.value;
  // The RF convention this engineer reads this instrument in (remembered per instrument, shared with the walk).
  const [remembered, setRemembered] = useState<string | undefined>(undefined);
  useEffect(() => {
    if (!store || !instrument) return;
    void store.getSetting<unknown>(probeConventionKey(instrument.id)).then((v) => {
      const f = probeConventionFrom(v);
      if (f) setRemembered(rfUnitId(f));
    }).catch((err: unknown) => notify(`The remembered probe convention could not be read (${errorText(err)}).`));
  }, [store, instrument, notify]);


  const type = draft ? choosable.find((t) => t.id === draft.typeId) ?? choosable[0] : undefined;
  const wantsChoices = type ? calibrantTypes.has(type.id) : false;

  // The calibrant ions chosen on this instrument so far (or the starting choice for its kind).
  useEffect(() => {
    if (!store || !wantsChoices || instrumentReadings) return;
    let stale = false;
    store.listInstrumentReadings(visit.instrumentId)
      .then((list) => { if (!stale) setInstrumentReadings(list); })
      .catch((err: unknown) => { if (!stale) { setInstrumentReadings([]); setProblem(`The calibrant ions chosen earlier could not be read: ${errorText(err)}`); } });
    return () => { stale = true; };
  }, [store, wantsChoices, instrumentReadings, visit.instrumentId]);
  const choices = useMemo(() => {
    if (!type || !wantsChoices || !instrumentReadings) return null;
    const c = calibrantChoices(instrument?.kind, instrumentReadings);
    // Ratios need a reference ion; widths and isotope ratios take each ion once (with its formula when one is known).
    const byText = new Map<string, CalibrantChoice>();
    for (const i of c.ions) {
      if (type.id === CALIBRANT_RATIO_TYPE && i.referenceMz === undefined) continue;
      const one = type.id === CALIBRANT_RATIO_TYPE ? i : { mz: i.mz, ...(i.formula ? { formula: i.formula } : {}) };
      const k = `${one.mz}/${one.referenceMz ?? ''}`;
      if (!byText.has(k) || (!byText.get(k)!.formula && one.formula)) byText.set(k, one);
    }
    return { why: c.why, ions: [...byText.values()] };
  }, [type, wantsChoices, instrumentReadings, instrument]);
  const unit = type && draft ? type.units.find((u) => u.id === draft.unitId) ?? type.units[0] : undefined;

  // Live expected value and verdict for what is typed so far.
  useEffect(() => {
    if (!store || !draft || !type) return;
    const r = checkEntry(type, draft.text, draft.unitId, draft.context);
    if (!r.ok) { setPreview(null); return; }
    let stale = false;
    void store.previewReading(visit.id, type.id, r.value, r.context).then((p) => { if (!stale) setPreview(p); }).catch((err: unknown) => {
      if (stale) return;
      setPreview(null);
      setProblem(`The expected value could not be worked out here: ${errorText(err)} The reading can still be saved.`);
    });
    return () => { stale = true; };
  }, [store, draft, type, visit.id]);

  if (!draft || !type || !unit) return <p>Loading the readings catalogue…</p>;

  function update(patch: Partial<ReadingDraft>) {
    const next = kept.update(patch);
    if (Object.keys(errors).length) {
      const t = choosable.find((x) => x.id === next.typeId)!;
      const r = checkEntry(t, next.text, next.unitId, next.context);
      setErrors(r.ok ? {} : Object.fromEntries(Object.entries(r.errors).filter(([k]) => k in errors)));
    }
  }

  function chooseType(id: string) {
    const t = choosable.find((x) => x.id === id)!;
    setErrors({});
    update({ ...blank(t, instrument, kept.latest()!.phase, remembered), note: kept.latest()!.note });
  }

  function pickIons(c: CalibrantChoice) {
    const context: Record<string, string> = { ...kept.latest()!.context, mz: String(c.mz) };
    if (type!.id === CALIBRANT_RATIO_TYPE && c.referenceMz !== undefined) context.referenceMz = String(c.referenceMz);
    if (type!.id === CALIBRANT_ISOTOPE_TYPE) context.formula = c.formula ?? '';
    update({ context });
  }

  function chooseUnit(id: string) {
    // Keep the quantity, not the digits: 1.2e-5 Torr becomes 1.6e-5 mbar.
    const old = unit!;
    const next = type!.units.find((u) => u.id === id)!;
    const typed = parseNumber(kept.latest()!.text);
    const text = typed === null ? kept.latest()!.text : formatNumber(fromBase(next, toBase(old, typed)), 6);
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
    const d = kept.latest()!;
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
      await kept.replace(next);
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
      <DraftProblem problem={kept.problem} />
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
      {choices && (
        <div class="field" data-testid="calibrant-choices">
          <p class="hint">Calibrant ions for this instrument — {choices.why}:</p>
          {choices.ions.length ? (
            <div class="row" role="group" aria-label="Calibrant ions">
              {choices.ions.map((c) => (
                <button key={`${c.mz}/${c.referenceMz ?? ''}`} type="button" class="btn btn-small" onClick={() => pickIons(c)}>{choiceText(c, type.id)}</button>
              ))}
            </div>
          ) : <p class="hint">None yet: type the ion below.</p>}
        </div>
      )}
      {type.context.map((f) => (
        <div key={f.key} class={errors[f.key] ? 'field has-error' : 'field'}>
          <label for={`reading-${f.key}`}>
            {f.label}{f.key === 'setpoint' ? <span class="unit"> ({unit.label})</span> : f.unit ? <span class="unit"> ({f.unit})</span> : null}
          </label>
          {f.kind === 'choice' ? (
            <select id={`reading-${f.key}`} value={draft.context[f.key] ?? ''} onChange={(ev) => update({ context: { ...kept.latest()!.context, [f.key]: (ev.target as HTMLSelectElement).value } })}>
              {f.choices!.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
            </select>
          ) : (
            <input id={`reading-${f.key}`} type="text" inputMode={f.kind === 'number' ? 'decimal' : 'text'} autoComplete="off"
              value={draft.context[f.key] ?? ''} aria-invalid={errors[f.key] ? 'true' : 'false'}
              onInput={(ev) => update({ context: { ...kept.latest()!.context, [f.key]: (ev.target as HTMLInputElement).value } })} />
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
            {e.basis === 'air signature'
              ? <><p class="expect-big" data-testid="reading-expected">Air looks like: {shownExpected}</p><p>Inside this band an air leak is likely</p></>
              : <><p class="expect-big" data-testid="reading-expected">Expected: {shownExpected}</p>
                <p>From {e.basis === 'generic' ? 'a generic range' : e.basis === 'maker limit' ? 'the maker’s limit' : e.basis === 'set value' ? 'the set value' : `the ${e.basis} value`}</p></>}
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
