// One-tap "Note this": hands the value to noteThis() and shows where it went.
import { useApp } from '../context';
import { noteThis, type NoteInput } from '../noteThis';

export function NoteButton(props: { note: NoteInput | null; compact?: boolean }) {
  const { store, instrument, notify } = useApp();
  const note = props.note;
  const ok = note !== null && Number.isFinite(note.value);
  return (
    <button
      type="button"
      class="btn btn-small note-btn"
      disabled={!ok}
      aria-label={ok ? `Note this: ${note!.label}` : 'Note this (no value to note)'}
      onClick={async () => {
        if (!ok) return;
        const r = await noteThis(store, instrument, note!);
        notify(r.message);
      }}
    >
      Note this
    </button>
  );
}

/** A labelled result with its value and a Note this button. */
export function Result(props: { label: string; value: string; note: NoteInput | null; testId?: string; hint?: string }) {
  return (
    <div class="result" data-testid={props.testId}>
      <div class="result-text">
        <span class="result-label">{props.label}</span>
        <span class="result-value">{props.value}</span>
        {props.hint && <span class="hint">{props.hint}</span>}
      </div>
      <NoteButton note={props.note} />
    </div>
  );
}
