import { useState } from 'preact/hooks';

/**
 * A button whose action is asked about in the page (never a native dialog): the first tap shows the question
 * with the confirming button and Cancel beside it; focus moves to the question so a screen reader reads it.
 */
export function ConfirmAction(props: {
  label: string;
  question: string;
  confirmLabel: string;
  onConfirm: () => void | Promise<void>;
  danger?: boolean;
  disabled?: boolean;
  class?: string;
}) {
  const [asking, setAsking] = useState(false);
  const btn = `btn${props.danger ? ' btn-danger' : ''}${props.class ? ` ${props.class}` : ''}`;
  if (!asking) return <button type="button" class={btn} disabled={props.disabled} onClick={() => setAsking(true)}>{props.label}</button>;
  return (
    <div class="confirm-box notice" role="group" aria-label={props.label} data-testid="confirm-box">
      <p tabIndex={-1} ref={(el) => el?.focus()}>{props.question}</p>
      <div class="row">
        <button type="button" class={btn} onClick={() => { setAsking(false); void props.onConfirm(); }}>{props.confirmLabel}</button>
        <button type="button" class="btn" onClick={() => setAsking(false)}>Cancel</button>
      </div>
    </div>
  );
}
