// The visit form: every keystroke is kept as a draft, so a reload or a crash never loses what was typed.
import { useEffect, useRef, useState } from 'preact/hooks';
import { draftFromVisit, emptyVisitDraft, validateVisitDraft, visitReasons, LIMITS, type Visit, type VisitDraft } from '../../store';
import { useApp } from '../context';
import { SelectField } from '../components/Field';
import { markSaved, markUnsaved } from '../offline';
import { navigate } from '../router';
import { errorText, toLocalInput } from './files';

type Errors = Partial<Record<keyof VisitDraft, string>>;

export function VisitForm(props: { visit?: Visit; instrumentId: string }) {
  const { store, notify } = useApp();
  const existing = props.visit;
  const draftKey = `visit-form:${existing?.id ?? `new:${props.instrumentId}`}`;
  const [draft, setDraft] = useState<VisitDraft | null>(null);
  const [errors, setErrors] = useState<Errors>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [restored, setRestored] = useState(false);
  const latest = useRef<VisitDraft | null>(null);
  latest.current = draft;

  useEffect(() => {
    if (!store || draft) return;
    const fresh = (): VisitDraft => {
      if (existing) return { ...draftFromVisit(existing), startedAt: toLocalInput(existing.startedAt) };
      return { ...emptyVisitDraft(props.instrumentId), startedAt: toLocalInput(new Date().toISOString()) };
    };
    void store.getDraft<VisitDraft>(draftKey).then((kept) => {
      if (kept) {
        setDraft(kept);
        setRestored(true);
        markUnsaved(draftKey, 'the visit form');
      } else setDraft(fresh());
    }).catch(() => setDraft(fresh()));
  }, [store, draftKey, draft, existing, props.instrumentId]);

  useEffect(() => () => markSaved(draftKey), [draftKey]);

  if (!draft) return <p>Loading…</p>;

  function update(patch: Partial<VisitDraft>) {
    const next = { ...latest.current!, ...patch };
    latest.current = next;
    setDraft(next);
    markUnsaved(draftKey, 'the visit form');
    if (Object.keys(errors).length) {
      const r = validateVisitDraft(next);
      setErrors(r.ok ? {} : Object.fromEntries(Object.entries(r.errors).filter(([k]) => k in errors)));
    }
    void store?.putDraft(draftKey, next).catch(() => undefined);
  }

  async function save(e: Event) {
    e.preventDefault();
    setProblem(null);
    const r = validateVisitDraft(latest.current!);
    if (!r.ok) {
      setErrors(r.errors);
      document.getElementById(`visit-${Object.keys(r.errors)[0]}`)?.focus();
      return;
    }
    setErrors({});
    if (!store) {
      setProblem('The database is not open, so nothing can be saved yet. Your input stays here.');
      return;
    }
    try {
      const saved = await store.saveVisit(r.fields, existing?.id);
      await store.clearDraft(draftKey).catch(() => undefined);
      markSaved(draftKey);
      if (!existing) await store.setCurrentVisit(saved.instrumentId, saved.id).catch(() => undefined);
      notify(existing ? 'Visit saved.' : 'Visit created: add readings below.');
      navigate(`/visits/${encodeURIComponent(saved.id)}`, { replace: !existing });
    } catch (err) {
      setProblem(`${errorText(err)} Your input stays here.`);
    }
  }

  async function discard() {
    await store?.clearDraft(draftKey).catch(() => undefined);
    markSaved(draftKey);
    navigate(existing ? `/visits/${encodeURIComponent(existing.id)}` : '/visits');
  }

  const text = (key: 'site' | 'engineer' | 'testEquipment' | 'partsUsed' | 'notes', label: string, multiline = false, hint?: string) => (
    <div class={errors[key] ? 'field has-error' : 'field'}>
      <label for={`visit-${key}`}>{label}</label>
      {multiline ? (
        <textarea id={`visit-${key}`} rows={3} value={draft[key]} aria-invalid={errors[key] ? 'true' : 'false'}
          onInput={(e) => update({ [key]: (e.target as HTMLTextAreaElement).value })} />
      ) : (
        <input id={`visit-${key}`} type="text" value={draft[key]} autoComplete="off" aria-invalid={errors[key] ? 'true' : 'false'}
          onInput={(e) => update({ [key]: (e.target as HTMLInputElement).value })} />
      )}
      {hint && <p class="hint">{hint}</p>}
      {errors[key] && <p class="field-error" role="alert">{errors[key]}</p>}
    </div>
  );

  return (
    <form class="form" onSubmit={save} noValidate data-testid="visit-form">
      {restored && <p class="notice">Restored the input you had not saved yet.</p>}
      <div class={errors.startedAt ? 'field has-error' : 'field'}>
        <label for="visit-startedAt">Started</label>
        <input id="visit-startedAt" type="datetime-local" value={draft.startedAt} aria-invalid={errors.startedAt ? 'true' : 'false'}
          onInput={(e) => update({ startedAt: (e.target as HTMLInputElement).value })} />
        {errors.startedAt && <p class="field-error" role="alert">{errors.startedAt}</p>}
      </div>
      {text('engineer', 'Engineer', false, 'Who did the work.')}
      {text('site', 'Site')}
      <SelectField id="visit-reason" label="Reason" value={draft.reason as never} options={visitReasons as never}
        onChange={(v) => update({ reason: v })} error={errors.reason} />
      {text('testEquipment', 'Test equipment', false, 'ID, rating and calibration due date of meters and probes used.')}
      {text('partsUsed', 'Parts used', true)}
      {text('notes', 'Notes', true, `Up to ${LIMITS.longText} characters. Shown as plain text.`)}
      {problem && <p class="banner banner-problem" role="alert">{problem}</p>}
      <div class="row sticky-actions">
        <button type="submit" class="btn btn-primary">{existing ? 'Save visit' : 'Create visit'}</button>
        <button type="button" class="btn" onClick={discard}>{restored ? 'Discard changes' : 'Cancel'}</button>
      </div>
    </form>
  );
}
