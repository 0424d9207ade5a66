import { useEffect, useRef, useState } from 'preact/hooks';
import {
  amplitudeForms, amplitudeReferences, draftFromProfile, emptyDraft, instrumentKinds, INSTRUMENT_UNDO_WINDOW_MS, numericFields, validateDraft,
  type DeletedInstrument, type InstrumentProfile, type ProfileDraft, type ProfileErrors,
} from '../../store';
import { useApp } from '../context';
import { NumberField, SelectField } from '../components/Field';
import { DraftProblem } from '../components/DraftProblem';
import { useDraft } from '../components/useDraft';
import { navigate, usePath } from '../router';
import { formatConvention, formatSi } from '../format';
import { ConfirmAction } from '../components/ConfirmAction';
import { errorText, storeSentence } from '../errorText';

export function InstrumentsScreen() {
  const path = usePath();
  const rest = path.slice('/instruments'.length).replace(/^\//, '');
  if (rest === '') return <InstrumentList />;
  return <InstrumentForm key={rest} id={rest === 'new' ? null : decodeURIComponent(rest)} />;
}

function InstrumentList() {
  const { instruments, instrument, store, selectInstrument, reloadInstruments, notify } = useApp();
  const [busy, setBusy] = useState(false);
  // A deleted instrument whose copy is still kept (also after a reload), so it can be put back.
  const [deleted, setDeleted] = useState<DeletedInstrument | undefined>(undefined);
  const hasDemo = instruments.some((p) => p.demo);

  // If the kept copy cannot be read, no restore is offered, and the user is told why.
  const checkDeleted = () => void store?.deletedInstrument().then(setDeleted).catch((err: unknown) => {
    setDeleted(undefined);
    notify(`A deleted profile that could still be restored could not be read: ${errorText(err)}`);
  });
  useEffect(checkDeleted, [store, notify]);

  async function restore(profile: InstrumentProfile) {
    if (!store) return;
    try {
      await store.restoreInstrument(profile);
      await reloadInstruments();
      notify(`Restored “${profile.name}”.`);
    } catch (err) {
      notify(errorText(err));
    }
    checkDeleted();
  }

  async function remove(p: InstrumentProfile) {
    if (!store) return;
    try {
      const removed = await store.deleteInstrument(p.id);
      await reloadInstruments();
      checkDeleted();
      if (removed) notify(`Deleted “${removed.name}”.`, { label: 'Undo', run: () => void restore(removed) });
    } catch (err) {
      notify(errorText(err));
    }
  }

  async function duplicate(p: InstrumentProfile) {
    if (!store) return;
    try {
      const copy = await store.duplicateInstrument(p.id);
      await reloadInstruments();
      navigate(`/instruments/${encodeURIComponent(copy.id)}`);
    } catch (err) {
      notify(errorText(err));
    }
  }

  async function toggleDemo() {
    if (!store) return;
    setBusy(true);
    try {
      if (hasDemo) {
        const n = await store.removeDemo();
        notify(`Removed ${n} demo instrument${n === 1 ? '' : 's'}.`);
      } else {
        await store.loadDemo(true);
        notify('Demo instruments loaded.');
      }
      await reloadInstruments();
    } catch (err) {
      notify(errorText(err));
    } finally {
      setBusy(false);
    }
  }

  return (
    <section class="screen">
      <h1>Instruments</h1>
      <p class="lede">Each profile holds the analyser geometry and RF supply that every expected value is computed from.</p>
      <div class="row">
        <a class="btn btn-primary" href="/instruments/new">New profile</a>
        {hasDemo ? (
          <ConfirmAction label="Remove demo data" question="Remove the invented demo instruments (and their demo visits)? Your own profiles stay."
            confirmLabel="Yes, remove the demo data" onConfirm={toggleDemo} disabled={busy || !store} />
        ) : (
          <button type="button" class="btn" onClick={toggleDemo} disabled={busy || !store}>Load demo data</button>
        )}
      </div>
      {deleted && (
        <div class="notice" data-testid="restore-deleted">
          <p>
            “{deleted.profile.name}” was deleted with {deleted.visits} visit{deleted.visits === 1 ? '' : 's'} and {deleted.readings} reading{deleted.readings === 1 ? '' : 's'}.
            A copy is kept on this device for {INSTRUMENT_UNDO_WINDOW_MS / 60_000} minutes, or until another instrument is deleted.
          </p>
          <button type="button" class="btn" onClick={() => restore(deleted.profile)}>Restore deleted {deleted.profile.name}</button>
        </div>
      )}
      {instruments.length === 0 && <p class="notice">No instrument profiles yet. Create one, or load the demo data.</p>}
      <ul class="cards" aria-label="Instrument profiles">
        {instruments.map((p) => (
          <li key={p.id} class="card" data-testid="instrument-card">
            <h2 class="card-title">
              {p.name}
              {p.id === instrument?.id && <span class="tag">in use</span>}
              {p.demo && <span class="tag tag-muted">demo</span>}
            </h2>
            <details class="facts-fold">
            <summary>{instrumentKinds.find((k) => k.value === p.kind)?.label ?? p.kind} · r0 {formatSi(p.rodFieldRadius * 1e3, 'mm')} · RF {formatSi(p.rfFrequency / 1e6, 'MHz')}</summary>
            <dl class="facts">
              <div><dt>Type</dt><dd>{instrumentKinds.find((k) => k.value === p.kind)?.label ?? p.kind}</dd></div>
              <div><dt>r0</dt><dd>{formatSi(p.rodFieldRadius * 1e3, 'mm')}</dd></div>
              <div><dt>Rods</dt><dd>{formatSi(p.rodLength * 1e3, 'mm')}</dd></div>
              <div><dt>RF</dt><dd>{formatSi(p.rfFrequency / 1e6, 'MHz')}</dd></div>
              <div><dt>RF max</dt><dd>{formatSi(p.maxRfAmplitude, 'V 0-p')}</dd></div>
              <div><dt>Ion energy</dt><dd>{formatSi(p.axialEnergy, 'eV')}</dd></div>
              <div><dt>Read-backs</dt><dd>{formatConvention(p.readbackConvention)}</dd></div>
            </dl>
            </details>
            {p.notes && <details class="notes-fold"><summary>Notes</summary><p class="notes">{p.notes}</p></details>}
            <div class="row">
              {p.id !== instrument?.id && (
                <button type="button" class="btn" onClick={() => selectInstrument(p.id)}>Use this one</button>
              )}
              <a class="btn" href={`/instruments/${encodeURIComponent(p.id)}`}>Edit</a>
              <button type="button" class="btn" onClick={() => duplicate(p)}>Duplicate</button>
              <button type="button" class="btn btn-danger" onClick={() => remove(p)}>Delete</button>
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}

function InstrumentForm(props: { id: string | null }) {
  const { store, instruments, reloadInstruments, selectInstrument, notify } = useApp();
  const existing = props.id ? instruments.find((p) => p.id === props.id) : undefined;
  const draftKey = `instrument-form:${props.id ?? 'new'}`;
  const [errors, setErrors] = useState<ProfileErrors>({});
  const [saveProblem, setSaveProblem] = useState<string | null>(null);
  // Start from a kept draft if there is one (nothing typed is ever lost), else from the profile.
  const kept = useDraft<ProfileDraft>({
    key: draftKey,
    what: 'the instrument profile form',
    ready: !(props.id && !existing),
    initial: () => (existing ? draftFromProfile(existing) : emptyDraft()),
  });
  const draft = kept.value;
  const restored = kept.restored;
  const dirty = useRef(false);
  if (restored) dirty.current = true;

  if (props.id && store && !existing) {
    return (
      <section class="screen">
        <h1>Profile not found</h1>
        <p>There is no instrument profile with this address on this device. It may have been deleted.</p>
        <a class="btn" href="/instruments">Back to instruments</a>
      </section>
    );
  }
  if (!draft) return <section class="screen"><p>Loading…</p></section>;

  function update(patch: Partial<ProfileDraft>) {
    const next = kept.update(patch);
    dirty.current = true;
    // Re-check only fields already flagged, so messages clear as soon as they are fixed.
    if (Object.keys(errors).length) {
      const r = validateDraft(next);
      setErrors(r.ok ? {} : Object.fromEntries(Object.entries(r.errors).filter(([k]) => k in errors)));
    }
  }

  async function save(e: Event) {
    e.preventDefault();
    setSaveProblem(null);
    const r = validateDraft(kept.latest()!);
    if (!r.ok) {
      setErrors(r.errors);
      const first = Object.keys(r.errors)[0];
      document.getElementById(`profile-${first}`)?.focus();
      return;
    }
    setErrors({});
    if (!store) {
      setSaveProblem('The database is not open, so nothing can be saved yet. Your input stays here.');
      return;
    }
    try {
      const saved = await store.saveInstrument(r.fields, existing?.id);
      await kept.clear();
      dirty.current = false;
      await reloadInstruments();
      if (!existing) selectInstrument(saved.id);
      notify(existing ? `Saved “${saved.name}”.` : `Created “${saved.name}”.`);
      navigate('/instruments');
    } catch (err) {
      setSaveProblem(storeSentence(err) ?? `Could not save: ${String(err)}. Your input stays here.`);
    }
  }

  async function discard() {
    await kept.clear();
    dirty.current = false;
    navigate('/instruments');
  }

  return (
    <section class="screen">
      <h1>{existing ? `Edit ${existing.name}` : 'New instrument profile'}</h1>
      {restored && <p class="notice">Restored the input you had not saved yet.</p>}
      <DraftProblem problem={kept.problem} />
      <form class="form" onSubmit={save} noValidate>
        <div class={errors.name ? 'field has-error' : 'field'}>
          <label for="profile-name">Name</label>
          <input id="profile-name" type="text" value={draft.name} maxLength={200} autoComplete="off"
            aria-invalid={errors.name ? 'true' : 'false'} aria-describedby={errors.name ? 'profile-name-error' : undefined}
            onInput={(e) => update({ name: (e.target as HTMLInputElement).value })} />
          {errors.name && <p class="field-error" id="profile-name-error" role="alert">{errors.name}</p>}
        </div>
        <SelectField id="profile-kind" label="Instrument type" value={draft.kind as never} options={instrumentKinds as never}
          onChange={(v) => update({ kind: v })} error={errors.kind} />
        {numericFields.map((spec) => (
          <NumberField key={spec.key} id={`profile-${spec.key}`} label={spec.label} unit={spec.unit} value={draft[spec.key]}
            onInput={(t) => update({ [spec.key]: t })} error={errors[spec.key]} hint={`${spec.help} Accepted: ${spec.min}–${spec.max} ${spec.unit}.`} />
        ))}
        <fieldset class="fieldset">
          <legend>How this instrument's read-backs state RF amplitude</legend>
          <SelectField id="profile-amplitude" label="Amplitude form" value={draft.amplitude as never} options={amplitudeForms as never}
            onChange={(v) => update({ amplitude: v })} error={errors.amplitude} />
          <SelectField id="profile-reference" label="Measured" value={draft.reference as never} options={amplitudeReferences as never}
            onChange={(v) => update({ reference: v })} error={errors.reference} />
          <p class="hint">Mixing these up makes every voltage wrong by a factor of 2 or more. Check the maker's documentation for the read-back.</p>
        </fieldset>
        <div class={errors.notes ? 'field has-error' : 'field'}>
          <label for="profile-notes">Notes</label>
          <textarea id="profile-notes" rows={3} value={draft.notes} onInput={(e) => update({ notes: (e.target as HTMLTextAreaElement).value })} />
          {errors.notes && <p class="field-error" role="alert">{errors.notes}</p>}
        </div>
        {saveProblem && <p class="banner banner-problem" role="alert">{saveProblem}</p>}
        <div class="row sticky-actions">
          <button type="submit" class="btn btn-primary">Save profile</button>
          <button type="button" class="btn" onClick={discard}>{dirty.current ? 'Discard changes' : 'Cancel'}</button>
        </div>
      </form>
    </section>
  );
}
