// The instrument line under a screen's title: the geometry the answer below comes from (the instrument's name is
// in the picker right above), and the way to its profile. Also the one-line wording of a scan line for the folded inputs.
import type { InstrumentProfile } from '../../store';
import { formatConvention, formatSi } from '../format';

export function InstrumentLine(props: { profile: InstrumentProfile; rods?: boolean }) {
  const p = props.profile;
  return (
    <p class="instrument-line" data-testid="instrument-line">
      <span class="visually-hidden">{p.name}: </span>
      <span class="instrument-facts">r0 {formatSi(p.rodFieldRadius * 1e3, 'mm')}{props.rods ? ` · rods ${formatSi(p.rodLength * 1e3, 'mm')}` : ''} · RF {formatSi(p.rfFrequency / 1e6, 'MHz')} · read-backs {formatConvention(p.readbackConvention)}</span>
      {' '}<a class="instrument-edit" href={`/instruments/${encodeURIComponent(p.id)}`}>Edit profile</a>
    </p>
  );
}

/** "apex" · "constant Δm 1 u · ref m/z 219" · "constant m/Δm 500": the scan line as typed, for a fold summary. */
export function scanLineSummary(v: { mode: string; width: string; referenceMz: string; resolution: string }): string {
  if (v.mode === 'constant-width') return `constant Δm ${v.width.trim() || '—'} u · ref m/z ${v.referenceMz.trim() || '—'}`;
  if (v.mode === 'constant-resolution') return `constant m/Δm ${v.resolution.trim() || '—'}`;
  return 'through the apex';
}
