// "Note this": records a computed or measured value in the instrument's current visit.
// Screens call only this function; how a visit is found or opened is the visit log's business (Store.noteReading).
import type { InstrumentProfile, NoteInput, Store } from '../store';
import { storeSentence } from './errorText';

export type { NoteInput };

export interface NoteResult {
  ok: boolean;
  /** A sentence for the toast: where the value went, or why it could not be kept. */
  message: string;
}

export async function noteThis(store: Store | null, instrument: InstrumentProfile | null, note: NoteInput): Promise<NoteResult> {
  if (!store) return { ok: false, message: 'The database is not open, so the value could not be noted.' };
  if (!instrument) return { ok: false, message: 'Pick an instrument first: notes go into that instrument’s current visit.' };
  try {
    const r = await store.noteReading(instrument, note);
    return { ok: true, message: `Noted in ${r.visitLabel}.` };
  } catch (err) {
    return { ok: false, message: storeSentence(err) ?? `Could not note the value: ${String(err)}` };
  }
}
