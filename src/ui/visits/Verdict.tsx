import { verdictWords, type Verdict } from '../../store';

/** A verdict as a word with a symbol (never colour alone). */
export function VerdictBadge(props: { verdict?: Verdict }) {
  if (!props.verdict) return <span class="verdict">— not judged</span>;
  const w = verdictWords[props.verdict];
  return <span class={`verdict verdict-${props.verdict}`} data-verdict={props.verdict}>{w.symbol} {w.word}</span>;
}
