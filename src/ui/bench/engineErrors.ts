// Engine validation errors carry the field name; screens place the message beside the field it belongs to.
import { InputRangeError } from '../../engine';
import { engineErrorWords } from '../../records';

export type FieldErrors = Record<string, string>;

/**
 * Runs an engine call. On InputRangeError the refusal is filed, in plain words (records' engineErrorWords: the
 * field's label and the limit in the unit on screen), under the screen field mapped from the engine's field name
 * (else under `fallback`); anything else is re-thrown.
 */
export function tryEngine<T>(run: () => T, fieldMap: Record<string, string>, errors: FieldErrors, fallback: string): T | null {
  try {
    return run();
  } catch (err) {
    if (err instanceof InputRangeError) {
      const base = err.field.replace(/\[\d+\].*$/, '');
      const target = fieldMap[err.field] ?? fieldMap[base] ?? fallback;
      if (!errors[target]) errors[target] = engineErrorWords(err);
      return null;
    }
    throw err;
  }
}
