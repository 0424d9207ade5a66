// Screen inputs kept as typed, per instrument profile and screen, in the store's settings, so a reload, a
// profile switch or an update never loses them. Parsing accepts a decimal comma (gloved thumbs, EU keypads).
import { useEffect, useRef, useState } from 'preact/hooks';
import { LIST_RULE_WORDS, formatNumber as formatListNumber, readNumber, splitNumberList, type InstrumentProfile } from '../../records';
import { useApp } from '../context';

export type Inputs = Record<string, string>;

/** Inputs for `screen` on the current instrument: [values, update]. Defaults fill anything never typed. */
export function usePersistentInputs<T extends Inputs>(screen: string, defaults: (p: InstrumentProfile | null) => T): [T, (patch: Partial<T>) => void] {
  const { store, instrument } = useApp();
  const key = `inputs:${screen}:${instrument?.id ?? 'none'}`;
  const [state, setState] = useState<{ key: string; values: T }>(() => ({ key, values: defaults(instrument) }));
  const defaultsRef = useRef(defaults);
  defaultsRef.current = defaults;
  // Typing before the kept values arrive wins over them: nothing typed is lost.
  const typedSinceLoad = useRef(false);

  useEffect(() => {
    let cancelled = false;
    const base = defaultsRef.current(instrument);
    typedSinceLoad.current = false;
    setState({ key, values: base });
    if (!store || !instrument) return;
    store.getSetting<Partial<T>>(key).then((kept) => {
      if (!cancelled && !typedSinceLoad.current && kept && typeof kept === 'object') setState({ key, values: { ...base, ...kept } });
    }).catch(() => undefined);
    return () => {
      cancelled = true;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key, store]);

  function update(patch: Partial<T>) {
    typedSinceLoad.current = true;
    setState((s) => {
      const values = { ...s.values, ...patch } as T;
      if (store && instrument) void store.setSetting(s.key, values).catch(() => undefined);
      return { key: s.key, values };
    });
  }
  return [state.values, update];
}

export type Parsed = { ok: true; value: number } | { ok: false; message: string };

/** A number as typed: decimal comma allowed, exponent allowed (1e-5, 1,5e-5, 1,5×10^-5). */
export function parseNumber(text: string, label: string, example = '1.5'): Parsed {
  const r = readNumber(text, (t) => t.replace(/×10\^?/, 'e'));
  if ('value' in r) return { ok: true, value: r.value };
  if (r.problem === 'empty') return { ok: false, message: `${label}: enter a number, e.g. ${example}.` };
  if (r.problem === 'not-a-number') return { ok: false, message: `${label}: “${text.trim()}” is not a number; e.g. ${example}.` };
  return { ok: false, message: `${label}: the number is too large.` };
}

/** A list of m/z values, split by the one list rule of src/records (splitNumberList, LIST_RULE_WORDS). */
export function parseMzList(text: string, label = 'm/z list'): { ok: true; values: number[] } | { ok: false; message: string } {
  const parts = splitNumberList(text);
  if (parts.length === 0) return { ok: false, message: `${label}: enter one m/z or several separated by commas, e.g. 69, 219, 502.` };
  if (parts.length > 24) return { ok: false, message: `${label}: at most 24 values at a time (you entered ${parts.length}).` };
  const values: number[] = [];
  for (const p of parts) {
    const r = parseNumber(p, label, '69');
    if (!r.ok) return { ok: false, message: `${label}: “${p}” is not a number; separate values with semicolons or spaces, e.g. 69; 219; 502.` };
    values.push(r.value);
  }
  return { ok: true, values };
}

/** The list field's hint: the one list rule, and how the list was read ("Read as: 219.5; 69"). */
export function listHint(list: ReturnType<typeof parseMzList>): string {
  return list.ok ? `${LIST_RULE_WORDS} Read as: ${list.values.map((v) => formatListNumber(v, 6)).join('; ')}.` : LIST_RULE_WORDS;
}
