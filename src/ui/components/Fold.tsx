// Phone-first folding: inputs that keep their values between visits fold to one line, so the answer comes first;
// a one-line caution opens the full card in place; long secondary material waits behind a disclosure.
import type { ComponentChildren } from 'preact';
import { useEffect, useRef, useState } from 'preact/hooks';
import { nextTask } from '../../records';

/**
 * Inputs folded to a one-line summary ("m/z 69 · constant Δm 1 u — change"). The whole line is a button with
 * aria-expanded; opening it moves focus to the first field. The fields stay in the page while folded (hidden), so
 * what was typed is never dropped; an invalid field opens the fold by itself so its message is seen.
 */
export function InputsFold(props: { id: string; summary: string; invalid?: boolean; children: ComponentChildren; testId?: string }) {
  const [open, setOpen] = useState(!!props.invalid);
  // The folded fields are built a task after the screen's first draw (at once if the fold opens first), so the
  // answer is drawn without them; from then on they stay in the page.
  const built = useTaskAfterFirstDraw(!!props.invalid);
  const body = useRef<HTMLDivElement>(null);
  const focusFirst = useRef(false);
  useEffect(() => {
    if (props.invalid) setOpen(true);
  }, [props.invalid]);
  useEffect(() => {
    if (!open || !focusFirst.current) return;
    focusFirst.current = false;
    body.current?.querySelector<HTMLElement>('input, select, textarea')?.focus();
  }, [open]);
  const bodyId = `${props.id}-fields`;
  return (
    <div class={open ? 'fold fold-open' : 'fold'} data-testid={props.testId}>
      <button type="button" class="fold-toggle" id={`${props.id}-toggle`} aria-expanded={open ? 'true' : 'false'} aria-controls={bodyId}
        onClick={() => {
          focusFirst.current = !open;
          setOpen(!open);
        }}>
        <span class="fold-summary">{props.summary}</span>
        <span class="fold-action" aria-hidden="true">{open ? 'done' : 'change'}</span>
        <span class="visually-hidden">{open ? ' — fold the fields' : ' — change'}</span>
      </button>
      <div id={bodyId} ref={body} class="fold-body" hidden={!open}>
        {(built || open) && props.children}
      </div>
    </div>
  );
}

/**
 * What a closed disclosure holds is built the first time it opens, and kept from then on (so anything typed in it
 * stays while it is closed again). A screen's first draw then builds only what is on show: on a phone the closed
 * cards and tools below the answer were most of the first draw's work.
 */
export function useShownOnce(open: boolean | undefined): [boolean, (e: Event) => void] {
  const [shown, setShown] = useState(!!open);
  const onToggle = (e: Event) => {
    if ((e.currentTarget as HTMLDetailsElement).open) setShown(true);
  };
  return [shown || !!open, onToggle];
}

/** A one-line caution whose full card is one tap away (for screens that only compute). */
export function CautionLine(props: { text: ComponentChildren; children: ComponentChildren; testId?: string }) {
  const [shown, onToggle] = useShownOnce(false);
  return (
    <details class="caution-line" data-testid={props.testId} onToggle={onToggle}>
      <summary><span class="caution-mark" aria-hidden="true">⚠</span><span>{props.text}</span></summary>
      <div class="caution-line-body">{shown && props.children}</div>
    </details>
  );
}

/** Secondary material (assumptions, sources, conventions, further tools) behind a full-height disclosure. */
export function More(props: { title: ComponentChildren; children: ComponentChildren; testId?: string; open?: boolean; class?: string }) {
  const [shown, onToggle] = useShownOnce(props.open);
  return (
    <details class={props.class ? `card more ${props.class}` : 'card more'} data-testid={props.testId} open={props.open} onToggle={onToggle}>
      <summary><strong>{props.title}</strong></summary>
      <div class="more-body">{shown && props.children}</div>
    </details>
  );
}

/**
 * A closed disclosure inside a card (no frame of its own): conventions, legends, further figures. Its body is built
 * the first time it opens and kept after, as with More.
 */
export function Disclosure(props: { class?: string; summary: ComponentChildren; children: ComponentChildren; testId?: string }) {
  const [shown, onToggle] = useShownOnce(false);
  return (
    <details class={props.class} data-testid={props.testId} onToggle={onToggle}>
      <summary>{props.summary}</summary>
      {shown && props.children}
    </details>
  );
}

/**
 * Sections below a screen's answer join the page one task after it, so the answer's first draw (and its layout)
 * is not one long task with everything under it. Place it after the answer; what follows it in the page should be
 * inside it too, so nothing already drawn moves when it arrives. `data-later` marks it until then (tests wait for
 * it to go).
 */
export function Later(props: { children: ComponentChildren }) {
  return useTaskAfterFirstDraw(false) ? <>{props.children}</> : <div data-later="" />;
}

/** False at the first draw and true from one task later (or true from the start when `atOnce`). */
function useTaskAfterFirstDraw(atOnce: boolean): boolean {
  const [ready, setReady] = useState(atOnce);
  useEffect(() => {
    if (ready) return;
    let live = true;
    void nextTask().then(() => live && setReady(true));
    return () => {
      live = false;
    };
  }, [ready]);
  return ready;
}
