import { useState } from 'preact/hooks';
import type { ComponentChildren } from 'preact';
import { checkTyped, type EntrySpec } from '../../records';

/**
 * The one field for a measured number: a text keyboard (so a phone offers the exponent, the minus sign and the
 * µ/m/k prefixes), the one number-entry rule of src/records checked when the field is left, and one message
 * tied to the field by aria-describedby with aria-invalid set. `showError` forces the message (after a save).
 * Empty is not an error on leaving the field; the owner decides whether a value is needed.
 */
export function NumberEntry(props: {
  id: string;
  label: ComponentChildren;
  spec: EntrySpec;
  value: string;
  onInput: (text: string) => void;
  hint?: ComponentChildren;
  showError?: boolean;
  class?: string;
}) {
  const [left, setLeft] = useState(false);
  const check = checkTyped(props.value, props.spec);
  const show = (left || props.showError) && !check.ok && (props.value.trim() !== '' || props.showError);
  const errorId = `${props.id}-error`;
  const hintId = `${props.id}-hint`;
  const describedBy = [show ? errorId : '', props.hint ? hintId : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div class={`${show ? 'field has-error' : 'field'}${props.class ? ` ${props.class}` : ''}`}>
      <label for={props.id}>{props.label}</label>
      <input
        id={props.id}
        type="text"
        inputMode="text"
        autoComplete="off"
        autoCapitalize="off"
        spellcheck={false}
        value={props.value}
        aria-invalid={show ? 'true' : 'false'}
        aria-describedby={describedBy}
        onInput={(e) => props.onInput((e.target as HTMLInputElement).value)}
        onBlur={() => setLeft(true)}
      />
      {props.hint && <p class="hint" id={hintId}>{props.hint}</p>}
      {show && !check.ok && <p class="field-error" id={errorId} data-testid={`${props.id}-error`}>{check.message}</p>}
    </div>
  );
}
