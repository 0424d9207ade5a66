// A walk reading as a visit-log note: the catalogue type where the step names one (so it is judged and trended
// with the other visits), with the unit and context that type expects; otherwise a plain noted value.
import { treeById, type DiagnoseInstrument, type Reading as WalkReading } from '../../../diagnose';
import { convert } from '../../../records';
import type { NoteInput } from '../../noteThis';

function rfUnitId(i: DiagnoseInstrument): string {
  const a = i.readbackConvention.amplitude === 'zero-to-peak' ? 'V0p' : i.readbackConvention.amplitude === 'peak-to-peak' ? 'Vpp' : 'Vrms';
  return `${a}-${i.readbackConvention.reference === 'per-rod' ? 'rod' : 'pairs'}`;
}

/** Plain noted value: label, value and unit as recorded in the walk, and its phase (as-left after an action). */
export function plainNote(r: WalkReading): NoteInput {
  const context: Record<string, string | number> = { walkStep: `${r.treeId}/${r.nodeId}`, verdict: r.verdict };
  if (r.expected !== null) context.expected = r.expected;
  if (r.tool) context.tool = r.tool.slice(0, 200);
  return { label: `${r.quantity} — diagnosis walk`, value: r.value, unit: r.unit, context, origin: 'entered', phase: r.phase };
}

/** The note for the visit log, typed where the step names a catalogue type and the units fit. */
export function visitNote(r: WalkReading, instrument: DiagnoseInstrument | null): NoteInput {
  const plain = plainNote(r);
  // As-left readings close an action, which names no catalogue type: they stay noted values, marked as-left.
  if (r.phase !== 'as-found') return plain;
  const node = treeById(r.treeId).nodes.find((n) => n.id === r.nodeId);
  const type = node?.kind === 'measure' ? node.measure.visitType : undefined;
  if (!type) return plain;
  const mz = r.inputs.mz?.value;
  const typed = (unit: string, value: number, context: Record<string, string | number>): NoteInput => ({
    ...plain,
    typeId: type,
    unit,
    value,
    context: { ...plain.context, ...context },
  });
  switch (type) {
    case 'vacuum-high':
      return typed(r.unit, r.value, { gaugeGas: 'N2-equivalent' });
    case 'emission-current':
      return typed(r.unit, r.value, r.expected !== null ? { setpoint: r.expected } : {});
    case 'multiplier-voltage':
    case 'rf-frequency':
      return typed(r.unit, r.value, {});
    case 'rf-amplitude':
      if (!instrument || mz === undefined) return plain;
      return typed(rfUnitId(instrument), convert(r.value, r.unit, 'V'), { mz });
    case 'dc-amplitude':
      if (!instrument || mz === undefined) return plain;
      return typed(instrument.readbackConvention.reference === 'per-rod' ? 'V-rod' : 'V-pairs', convert(r.value, r.unit, 'V'), { mz });
    case 'air-ratio-28-32':
      return typed('ratio', r.value, {});
    default:
      return plain;
  }
}
