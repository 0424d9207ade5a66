// The field-mode switch in the top bar: reachable from every screen, named for what it is for.
import { useApp } from '../context';
import { useFieldMode } from '../fieldMode';

export function FieldModeToggle() {
  const { notify } = useApp();
  const [on, set] = useFieldMode();
  return (
    <button type="button" class={on ? 'field-toggle on' : 'field-toggle'} aria-pressed={on ? 'true' : 'false'} data-testid="field-mode"
      aria-label="Field mode: gloves & bright light"
      title="Field mode: gloves & bright light (bigger targets and type, high contrast)"
      onClick={() => {
        const kept = set(!on);
        if (!kept) notify('This device would not keep the setting: field mode holds until Rodside is reloaded.');
      }}>
      <svg width="22" height="22" viewBox="0 0 24 24" aria-hidden="true" fill="none" stroke="currentColor" stroke-width="2" stroke-linecap="round">
        <circle cx="12" cy="12" r="4.2" />
        <path d="M12 2.5v2.6M12 18.9v2.6M2.5 12h2.6M18.9 12h2.6M5.3 5.3l1.8 1.8M16.9 16.9l1.8 1.8M5.3 18.7l1.8-1.8M16.9 7.1l1.8-1.8" />
      </svg>
      <span class="field-toggle-text">Field mode</span>
    </button>
  );
}
