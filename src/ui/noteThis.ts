// "Note this": records a computed or measured value in the instrument's current visit.
// Screens call only this function; how a visit is found or opened is the visit log's business.
import type { InstrumentProfile, Store } from '../store';

export interface NoteInput {
  /** Reading type id from the catalogue where one fits (e.g. 'rf-amplitude'), else a free label is used. */
  typeId?: string;
  /** What the value is, in words, e.g. "Expected RF at m/z 502 (apex scan line)". */
  label: string;
  /** Value in the unit given. */
  value: number;
  unit: string;
  /** Context such as parked m/z, convention, gauge gas. */
  context?: Record<string, string | number>;
  /** Where it came from: a calculator or a measurement typed in. */
  origin: 'calculator' | 'entered';
}

export interface NoteResult {
  ok: boolean;
  /** A sentence for the toast: where the value went, or why it could not be kept. */
  message: string;
}

export async function noteThis(store: Store | null, instrument: InstrumentProfile | null, note: NoteInput): Promise<NoteResult> {
  if (!store) return { ok: false, message: 'The database is not open, so the value could not be noted.' };
  if (!instrument) return { ok: false, message: 'Pick an instrument first: notes go into that instrument’s current visit.' };
  const withNotes = store as Store & { noteReading?: (i: InstrumentProfile, n: NoteInput) => Promise<{ visitLabel: string }> };
  if (!withNotes.noteReading) return { ok: false, message: 'The visit log is not part of this build yet, so the value was not noted.' };
  try {
    const r = await withNotes.noteReading(instrument, note);
    return { ok: true, message: `Noted in ${r.visitLabel}.` };
  } catch (err) {
    return { ok: false, message: (err as { userMessage?: string }).userMessage ?? `Could not note the value: ${String(err)}` };
  }
}
