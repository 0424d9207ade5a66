import type { Verdict } from '../../../diagnose';

type Shown = Verdict | 'recorded' | 'convention';
const SYMBOL: Record<Shown, string> = { pass: '✓', borderline: '△', fail: '✗', recorded: '•', convention: '⇄' };

/** A verdict as a word and a symbol, never colour alone. */
export function VerdictWord(props: { verdict: Shown; side?: 'low' | 'high' }) {
  const word = props.verdict === 'convention' ? 'check the convention' : props.verdict;
  const side = props.side && props.verdict !== 'pass' && props.verdict !== 'recorded' && props.verdict !== 'convention' ? ` (${props.side})` : '';
  return (
    <span class={`verdict verdict-${props.verdict}`} data-testid="verdict">
      <span aria-hidden="true">{SYMBOL[props.verdict]} </span>
      {word}
      {side}
    </span>
  );
}
