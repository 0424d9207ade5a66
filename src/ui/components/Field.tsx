import type { ComponentChildren } from 'preact';

let fieldCounter = 0;
export function nextFieldId(prefix = 'f'): string {
  fieldCounter += 1;
  return `${prefix}-${fieldCounter}`;
}

/** A labelled text input for a number (kept as typed), with unit and the message for a bad value beside it. */
export function NumberField(props: {
  id: string;
  label: string;
  unit?: string;
  value: string;
  onInput: (text: string) => void;
  error?: string | null;
  hint?: ComponentChildren;
  name?: string;
  /** Keyboard on phones: 'decimal' (default) has no minus, exponent or list separators; use 'text' for those. */
  inputMode?: 'decimal' | 'text' | 'numeric';
}) {
  const errorId = `${props.id}-error`;
  const hintId = `${props.id}-hint`;
  const describedBy = [props.error ? errorId : '', props.hint ? hintId : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div class={props.error ? 'field has-error' : 'field'}>
      <label for={props.id}>
        {props.label}
        {props.unit && <span class="unit"> ({props.unit})</span>}
      </label>
      <input
        id={props.id}
        name={props.name ?? props.id}
        type="text"
        inputMode={props.inputMode ?? 'decimal'}
        autoComplete="off"
        spellcheck={false}
        value={props.value}
        aria-invalid={props.error ? 'true' : 'false'}
        aria-describedby={describedBy}
        onInput={(e) => props.onInput((e.target as HTMLInputElement).value)}
      />
      {props.hint && <p class="hint" id={hintId}>{props.hint}</p>}
      {props.error && <p class="field-error" id={errorId} role="alert">{props.error}</p>}
    </div>
  );
}

export function SelectField<T extends string>(props: {
  id: string;
  label: string;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (v: T) => void;
  error?: string | null;
}) {
  return (
    <div class={props.error ? 'field has-error' : 'field'}>
      <label for={props.id}>{props.label}</label>
      <select id={props.id} value={props.value} aria-invalid={props.error ? 'true' : 'false'}
        onChange={(e) => props.onChange((e.target as HTMLSelectElement).value as T)}>
        {props.options.map((o) => (
          <option key={o.value} value={o.value}>{o.label}</option>
        ))}
      </select>
      {props.error && <p class="field-error" role="alert">{props.error}</p>}
    </div>
  );
}
