// What a screen that computes for an instrument shows when it has none. While the app is still opening this
// device's records it does not know yet: it then holds the space of a screen, so the results do not push the
// page about when they arrive (no layout shift), and only says "pick or add one" once the records are open.
import type { ComponentChildren } from 'preact';
import { useApp } from '../context';

export function NeedInstrument(props: { children: ComponentChildren }) {
  const { store, storeProblem } = useApp();
  if (!store && !storeProblem) {
    return (
      <div class="instrument-pending" aria-busy="true" data-testid="instrument-pending">
        <p class="muted">Opening the instrument profiles kept on this device…</p>
      </div>
    );
  }
  return (
    <p class="notice">
      {props.children} <a href="/instruments/new">Add an instrument</a>
    </p>
  );
}
