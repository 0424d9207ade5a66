import { useEffect, useState } from 'preact/hooks';
import {
  choiceOfForm, formOfChoice, probeConventionFrom, probeConventionKey, rfFormWords,
  type AmplitudeForm, type AmplitudeReference,
} from '../../records';
import type { RfForm } from '../../engine';
import { useApp } from '../context';

const AMPLITUDES: { value: AmplitudeForm; label: string }[] = [
  { value: 'zero-to-peak', label: 'zero-to-peak' },
  { value: 'peak-to-peak', label: 'peak-to-peak' },
  { value: 'rms', label: 'rms' },
];
const REFERENCES: { value: AmplitudeReference; label: string }[] = [
  { value: 'per-rod', label: 'one rod to ground' },
  { value: 'between-pairs', label: 'between the pairs' },
];

/**
 * The convention the engineer reads an instrument's RF in at the probe: remembered per instrument (settings),
 * defaulting to the instrument's read-back. Returns the form and a setter that remembers the choice.
 */
export function useProbeConvention(instrumentId: string | undefined, readback: RfForm): [RfForm, (f: RfForm) => void] {
  const { store, notify } = useApp();
  const [form, setForm] = useState<RfForm | undefined>(undefined);
  useEffect(() => {
    if (!store || !instrumentId) return;
    let live = true;
    store.getSetting<unknown>(probeConventionKey(instrumentId))
      .then((v) => { if (live) setForm((cur) => cur ?? probeConventionFrom(v)); })
      .catch((err: unknown) => notify(`The remembered probe convention could not be read (${(err as Error).message}); the read-back convention is used.`));
    return () => { live = false; };
  }, [store, instrumentId, notify]);
  const choose = (f: RfForm) => {
    setForm(f);
    if (store && instrumentId) {
      store.setSetting(probeConventionKey(instrumentId), f)
        .catch((err: unknown) => notify(`The probe convention could not be remembered (${(err as Error).message}).`));
    }
  };
  return [form ?? readback, choose];
}

/** One tap to change how the value at the probe is read: the amplitude form and what it is measured against. */
export function ConventionChoice(props: { id: string; value: RfForm; readback: RfForm; onChange: (f: RfForm) => void }) {
  const c = choiceOfForm(props.value);
  const pick = (amplitude: AmplitudeForm, reference: AmplitudeReference) => props.onChange(formOfChoice(amplitude, reference));
  return (
    <fieldset class="fieldset convention-choice" data-testid={props.id}>
      <legend>How you read it</legend>
      <div class="seg" role="group" aria-label="Amplitude">
        {AMPLITUDES.map((a) => (
          <button key={a.value} type="button" class={c.amplitude === a.value ? 'btn seg-on' : 'btn'} aria-pressed={c.amplitude === a.value}
            onClick={() => pick(a.value, c.reference)}>{a.label}</button>
        ))}
      </div>
      <div class="seg" role="group" aria-label="Measured against">
        {REFERENCES.map((r) => (
          <button key={r.value} type="button" class={c.reference === r.value ? 'btn seg-on' : 'btn'} aria-pressed={c.reference === r.value}
            onClick={() => pick(c.amplitude, r.value)}>{r.label}</button>
        ))}
      </div>
      <p class="hint">
        {props.value === props.readback ? 'The instrument’s read-back convention.' : `The instrument reads back ${rfFormWords[props.readback]}.`}
      </p>
    </fieldset>
  );
}
