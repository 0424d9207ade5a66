// The visit form: every keystroke is kept as a draft, so a reload or a crash never loses what was typed.
import { useState } from 'preact/hooks';
import { draftFromVisit, emptyVisitDraft, validateVisitDraft, visitReasons, LIMITS, type Visit, type VisitDraft } from '../../store';
import { useApp } from '../context';
import { SelectField } from '../components/Field';
import { DraftProblem } from '../components/DraftProblem';
import { useDraft } from '../components/useDraft';
import { navigate } from '../router';
import { toLocalInput } from './files';
import { errorText } from '../errorText';

type Errors = Partial<Record<keyof VisitDraft, string>>;

export function VisitForm(props: { visit?: Visit; instrumentId: string }) {
  const { store, notify } = useApp();
  const existing = props.visit;
  const draftKey = `visit-form:${existing?.id ?? `new:${props.instrumentId}`}`;
  const [errors, setErrors] = useState<Errors>({});
  const [problem, setProblem] = useState<string | null>(null);
  const kept = useDraft<VisitDraft>({
    key: draftKey,
    what: 'the visit form',
    initial: () => existing
      ? { ...draftFromVisit(existing), startedAt: toLocalInput(existing.startedAt) }
      : { ...emptyVisitDraft(props.instrumentId), startedAt: toLocalInput(new Date().toISOString()) },
  });
  const draft = kept.value;
  const restored = kept.restored;

  if (!draft) return <p>Loading…</p>;

  function update(patch: Partial<VisitDraft>) {
    const next = kept.update(patch);
    if (Object.keys(errors).length) {
      const r = validateVisitDraft(next);
      setErrors(r.ok ? {} : Object.fromEntries(Object.entries(r.errors).filter(([k]) => k in errors)));
    }
  }

  async function save(e: Event) {
    e.preventDefault();
    setProblem(null);
    const r = validateVisitDraft(kept.latest()!);
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
      await kept.clear();
      if (!existing) {
        // The visit is saved either way; only "Note this" would not know it is the open one. Say so.
        await store.setCurrentVisit(saved.instrumentId, saved.id).catch((err: unknown) =>
          notify(`Visit created, but it could not be made the open visit: ${errorText(err)}`));
      }
      notify(existing ? 'Visit saved.' : 'Visit created: add readings below.');
      navigate(`/visits/${encodeURIComponent(saved.id)}`, { replace: !existing });
    } catch (err) {
      setProblem(`${errorText(err)} Your input stays here.`);
    }
  }

  async function discard() {
    await kept.clear();
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
      <DraftProblem problem={kept.problem} />
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
