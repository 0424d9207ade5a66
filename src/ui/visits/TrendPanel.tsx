// Trend of one reading type across the instrument's visits: chart (uPlot via the shared wrapper), a table
// with the same numbers for screen readers and print, the fitted rate, and for the multiplier voltage the
// projected date it reaches the supply limit.
import { useEffect, useMemo, useState } from 'preact/hooks';
import { formatNumber, fromBase, SECONDS_PER_MONTH, type ReadingContext, type ReadingType, type TrendData } from '../../store';
import { Chart, type ChartOptions, type ChartPalette, type uPlot } from '../components/Chart';
import { useApp } from '../context';
import { errorText } from '../errorText';

const FIVE_YEARS_MS = 5 * 365.2425 * 86400_000;

export function TrendPanel(props: { instrumentId: string; types: ReadingType[] }) {
  const { store } = useApp();
  const [available, setAvailable] = useState<ReadingType[]>([]);
  const [typeId, setTypeId] = useState<string>('');
  const [series, setSeries] = useState<ReadingContext[]>([]);
  const [seriesIndex, setSeriesIndex] = useState(0);
  const [allTime, setAllTime] = useState(false);
  const [trend, setTrend] = useState<TrendData | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  useEffect(() => {
    if (!store) return;
    void store.listInstrumentReadings(props.instrumentId).then((rs) => {
      const ids = new Set(rs.map((r) => r.typeId));
      const list = props.types.filter((t) => ids.has(t.id) && t.id !== 'noted-value');
      setAvailable(list);
      setTypeId((cur) => (list.some((t) => t.id === cur) ? cur : list.find((t) => t.id === 'multiplier-voltage')?.id ?? list[0]?.id ?? ''));
    }).catch((err) => setProblem(errorText(err)));
  }, [store, props.instrumentId, props.types]);

  useEffect(() => {
    if (!store || !typeId) return;
    void store.trendSeries(props.instrumentId, typeId).then((s) => { setSeries(s); setSeriesIndex(0); }).catch((err) => setProblem(errorText(err)));
  }, [store, props.instrumentId, typeId]);

  const type = available.find((t) => t.id === typeId);
  const context = series[seriesIndex];

  useEffect(() => {
    if (!store || !typeId) return;
    const since = allTime ? undefined : new Date(Date.now() - FIVE_YEARS_MS).toISOString();
    void store.trend(props.instrumentId, typeId, { context, since }).then(setTrend).catch((err) => setProblem(errorText(err)));
  }, [store, props.instrumentId, typeId, context, allTime]);

  // Show in the type's default unit (mbar for pressures, V, µA…).
  const unit = type?.units.find((u) => u.id === type.defaultUnit) ?? type?.units[0];
  const data = useMemo<uPlot.AlignedData | null>(() => {
    if (!trend || !unit) return null;
    const conv = (col: (number | null)[]) => col.map((y) => (y === null ? null : fromBase(unit, y)));
    return [trend.x, conv(trend.asFound), conv(trend.asLeft), conv(trend.fit)];
  }, [trend, unit]);

  if (problem) return <p class="banner banner-problem" role="alert">{problem}</p>;
  if (available.length === 0) return <p class="muted">No readings for this instrument yet: trends appear once readings are recorded.</p>;

  const seriesLabel = (c: ReadingContext) => Object.entries(c).map(([k, v]) => `${k === 'mz' ? 'm/z' : k === 'referenceMz' ? 'relative to m/z' : k} ${v}`).join(', ') || 'all';
  const log = trend?.scale === 'log';
  const options = ({ amber, teal, muted }: ChartPalette): ChartOptions => ({
    scales: { x: { time: true }, y: log ? { distr: 3 } : {} },
    // Two-line date labels (month over year) need the room.
    // The unit is written above the chart in words, not as a rotated axis label (a rotated "V" reads like ">").
    axes: [{ size: 52 }, { size: 70 }],
    series: [
      {},
      // As found: hollow rings, no line; as left: filled dots joined; fit: dashed. Told apart by shape, not colour alone.
      { label: 'As found', stroke: amber, width: 0, points: { show: true, size: 10, width: 2, fill: 'transparent', stroke: amber } },
      { label: 'As left', stroke: teal, width: 2, points: { show: true, size: 9, fill: teal } },
      { label: 'Fitted line', stroke: muted, width: 1.5, dash: [6, 4], points: { show: false } },
    ],
  });
  const p = trend?.projection;

  return (
    <section class="card" data-testid="trend-panel">
      <h2 class="card-title">Trends across visits</h2>
      <div class="row">
        <div class="field" style={{ flex: '1 1 14rem' }}>
          <label for="trend-type">Reading</label>
          <select id="trend-type" value={typeId} onChange={(e) => setTypeId((e.target as HTMLSelectElement).value)}>
            {available.map((t) => <option key={t.id} value={t.id}>{t.label}</option>)}
          </select>
        </div>
        {series.length > 1 && (
          <div class="field" style={{ flex: '1 1 10rem' }}>
            <label for="trend-series">Series</label>
            <select id="trend-series" value={String(seriesIndex)} onChange={(e) => setSeriesIndex(Number((e.target as HTMLSelectElement).value))}>
              {series.map((c, i) => <option key={i} value={String(i)}>{seriesLabel(c)}</option>)}
            </select>
          </div>
        )}
        <label class="check"><input type="checkbox" checked={allTime} onChange={(e) => setAllTime((e.target as HTMLInputElement).checked)} /> All time (default: last five years)</label>
      </div>
      {data && trend && trend.x.length > 0 ? (
        <>
          <p class="hint" data-testid="trend-unit">Up the side: {trend.label} in {unit?.label ?? 'its base unit'}; along the bottom: visit date.</p>
          <Chart key={`${typeId}-${log}`} data={data} options={options} height={260} zoomButtons testId="trend-chart"
            label={`${trend.label} across ${trend.x.length} visits, as found and as left, with a fitted straight line${log ? ' on a logarithmic scale' : ''}.`} />
          <ul class="legend" aria-label="Legend">
            <li><svg width="18" height="18" aria-hidden="true"><circle cx="9" cy="9" r="5" fill="none" stroke="currentColor" stroke-width="2" /></svg> as found (ring)</li>
            <li><svg width="36" height="18" aria-hidden="true"><line x1="2" y1="9" x2="34" y2="9" stroke="currentColor" stroke-width="2" /><circle cx="18" cy="9" r="4.5" fill="currentColor" /></svg> as left (dot and line)</li>
            <li><svg width="36" height="18" aria-hidden="true"><line x1="2" y1="9" x2="34" y2="9" stroke="currentColor" stroke-width="1.5" stroke-dasharray="6 4" /></svg> fitted line (dashed)</li>
          </ul>
          {trend.line && unit && (
            <p>
              Fitted to {trend.fittedPhase} values ({trend.line.n} visits{log ? ', on log scale' : ''}):{' '}
              {log
                ? `${formatNumber((10 ** (trend.line.slope * SECONDS_PER_MONTH * 12) - 1) * 100, 3)} % per year`
                : `${formatNumber(fromBase(unit, trend.line.slope * SECONDS_PER_MONTH) - fromBase(unit, 0), 3)} ${unit.label} per month`}
              , r² {formatNumber(trend.line.r2, 3)}.
            </p>
          )}
          {p && (
            <p class="notice" data-testid="projection">
              {p.reachesAt === null
                ? `The multiplier voltage is not rising (${formatNumber(p.ratePerMonth, 3)} V per month): no end-of-life date to project.`
                : p.monthsFromLast === 0
                  ? `The multiplier voltage has reached the supply limit of ${formatNumber(p.limit)} V.`
                  : `At ${formatNumber(p.ratePerMonth, 3)} V per month the multiplier voltage reaches the supply limit of ${formatNumber(p.limit)} V around ${p.reachesAt.slice(0, 7)} (about ${formatNumber(p.monthsFromLast!, 2)} months after the last visit).`}{' '}
              {p.assumption}
            </p>
          )}
          <details>
            <summary>Values</summary>
            <div class="scroll-x">
              <table class="values trend-table">
                <thead><tr><th>Visit</th><th>As found ({unit?.label})</th><th>As left ({unit?.label})</th></tr></thead>
                <tbody>
                  {trend.x.map((x, i) => (
                    <tr key={trend.visitIds[i]}>
                      <td><a href={`/visits/${encodeURIComponent(trend.visitIds[i])}`}>{new Date(x * 1000).toISOString().slice(0, 10)}</a></td>
                      <td>{data[1][i] == null ? '—' : formatNumber(data[1][i] as number)}</td>
                      <td>{data[2][i] == null ? '—' : formatNumber(data[2][i] as number)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </details>
        </>
      ) : (
        <p class="muted">No readings of this type in the chosen time window.</p>
      )}
    </section>
  );
}
