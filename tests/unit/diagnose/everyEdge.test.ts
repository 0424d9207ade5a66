// Drive the walker itself along every edge of every shipped tree: each answer, each gate outcome and each
// verdict branch must give a valid, plain-JSON state, and every walk must end at an action (or a hand-over).
import { describe, expect, it } from 'vitest';
import { answer, judge, start, trees, type AnswerInput, type DiagnoseInstrument, type MeasureNode, type Tree, type WalkState } from '../../../src/diagnose';

const analyser: DiagnoseInstrument = {
  id: 'edge', name: 'Edge analyser', kind: 'gc-ms-single', rodFieldRadius: 4.5e-3, rodLength: 0.15, rfFrequency: 1e6,
  maxRfAmplitude: 1600, axialEnergy: 5, readbackConvention: { amplitude: 'zero-to-peak', reference: 'per-rod' },
};

/** Answers that reach each way out of a measure node. With no registry, computed expectations are judged by the engineer. */
function measureAnswers(node: MeasureNode): AnswerInput[] {
  const alternatives: AnswerInput[] = (node.alternatives ?? []).map((o) => ({ kind: 'option', optionId: o.id }));
  if (!node.expect) return [{ kind: 'measure', value: 1 }, ...alternatives];
  if ('calc' in node.expect) {
    return [
      { kind: 'measure', value: 1, verdict: { verdict: 'pass' } },
      { kind: 'measure', value: 1, verdict: { verdict: 'borderline', side: 'high' } },
      { kind: 'measure', value: 1, verdict: { verdict: 'fail', side: 'low' } },
      { kind: 'measure', value: 1, verdict: { verdict: 'fail', side: 'high' } },
      ...alternatives,
    ];
  }
  const { low, high } = node.expect.range;
  const limits = judge((low + high) / 2, { low, high }, node.expect.tolerance);
  const values = [(low + high) / 2, limits.borderHigh > high ? (high + limits.borderHigh) / 2 : undefined, low - Math.max(1, Math.abs(low)) * 1e3 - 1, (Number.isFinite(limits.borderHigh) ? limits.borderHigh : high) * 10 + 1];
  return [...values.filter((v): v is number => v !== undefined).map((value) => ({ kind: 'measure' as const, value })), ...alternatives];
}

function answersAt(tree: Tree, s: WalkState): AnswerInput[] {
  const node = tree.nodes.find((n) => n.id === s.nodeId)!;
  switch (node.kind) {
    case 'question':
    case 'choice':
      return node.options.map((o) => ({ kind: 'option', optionId: o.id }));
    case 'gate':
      return [
        { kind: 'gate', role: node.roles[0], confirmed: [...node.asks] },
        { kind: 'gate', role: node.roles[0], confirmed: [] },
      ];
    case 'measure':
      return measureAnswers(node);
    case 'action':
      return [];
  }
}

describe('the walker along every edge of every tree', () => {
  for (const tree of trees) {
    it(`${tree.id}: every node is reached and every walk ends at an action or a hand-over`, () => {
      const reached = new Set<string>();
      const endings = new Set<string>();
      const edges = new Set<string>();
      const queue: WalkState[] = [start(tree, analyser, { at: '2026-12-01T10:00:00.000Z' })];
      while (queue.length) {
        const s = queue.shift()!;
        reached.add(s.nodeId);
        if (s.status !== 'walking') {
          endings.add(s.status === 'at-leaf' ? `leaf ${s.nodeId}` : `hand-over ${s.handOver}`);
          expect(s.status === 'at-leaf' ? s.outcome?.closing : s.handOver).toBeTruthy();
          continue;
        }
        for (const a of answersAt(tree, s)) {
          const key = `${s.nodeId} ${JSON.stringify(a)}`;
          if (edges.has(key)) continue;
          edges.add(key);
          const next = answer(s, tree, a, { at: '2026-12-01T10:00:00.000Z', registry: {} });
          expect(JSON.parse(JSON.stringify(next))).toStrictEqual(next);
          queue.push(next);
        }
      }
      expect([...reached].sort()).toEqual(tree.nodes.map((n) => n.id).sort());
      expect(endings.size).toBeGreaterThan(0);
    });
  }
});
