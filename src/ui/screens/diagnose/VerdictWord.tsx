import type { Verdict } from '../../../diagnose';

const SYMBOL: Record<Verdict | 'recorded', string> = { pass: '✓', borderline: '△', fail: '✗', recorded: '•' };

/** A verdict as a word and a symbol, never colour alone. */
export function VerdictWord(props: { verdict: Verdict | 'recorded'; side?: 'low' | 'high' }) {
  const word = props.verdict === 'recorded' ? 'recorded' : props.verdict;
  const side = props.side && props.verdict !== 'pass' && props.verdict !== 'recorded' ? ` (${props.side})` : '';
  return (
    <span class={`verdict verdict-${props.verdict === 'recorded' ? 'recorded' : props.verdict}`} data-testid="verdict">
      <span aria-hidden="true">{SYMBOL[props.verdict]} </span>
      {word}
      {side}
    </span>
  );
}
