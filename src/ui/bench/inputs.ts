// Screen inputs kept as typed, per instrument profile and screen, in the store's settings, so a reload, a
// profile switch or an update never loses them (through the one draft hook, which says so when the device
// refuses to keep them). Parsing accepts a decimal comma (gloved thumbs, EU keypads).
import { LIST_RULE_WORDS, formatNumber as formatListNumber, readNumber, splitNumberList, type InstrumentProfile } from '../../records';
import { useMemo } from 'preact/hooks';
import { useApp } from '../context';
import { useDraft } from '../components/useDraft';

export type Inputs = Record<string, string>;

/**
 * Inputs for `screen` on the current instrument: [values, update, problem]. Defaults fill anything never typed;
 * typing before the kept values arrive wins over them. `problem` is the sentence to show (with DraftProblem)
 * when the device would not keep the inputs, else null.
 */
export function usePersistentInputs<T extends Inputs>(screen: string, defaults: (p: InstrumentProfile | null) => T): [T, (patch: Partial<T>) => void, string | null] {
  const { store, instrument } = useApp();
  const draft = useDraft<T>({
    key: `inputs:${screen}:${instrument?.id ?? 'none'}`,
    initial: () => defaults(instrument),
    what: `the ${screen} inputs`,
    kind: 'setting',
    whileLoading: 'initial',
    ready: Boolean(store && instrument),
    // Without a profile the inputs are only shown: they belong to no instrument.
    keep: Boolean(instrument),
    accept: (kept) => typeof kept === 'object' && kept !== null,
  });
  return [draft.value ?? defaults(instrument), (patch: Partial<T>) => void draft.update(patch), draft.problem];
}

/**
 * What a screen works out from its inputs and the instrument (scan line, exact edges, operating points: root
 * finding), again only when the inputs' content or the instrument changes, not on every redraw. The inputs object
 * itself may be rebuilt on a redraw, so its content is the key. Null without an instrument.
 */
export function useFromInputs<T extends Inputs, R>(inputs: T, instrument: InstrumentProfile | null, compute: (inputs: T, profile: InstrumentProfile) => R): R | null {
  const content = JSON.stringify(inputs);
  // `content` stands for `inputs`; `compute` is a plain function of its arguments.
  // eslint-disable-next-line react-hooks/exhaustive-deps
  return useMemo(() => (instrument ? compute(inputs, instrument) : null), [content, instrument]);
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
