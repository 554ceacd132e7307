'use client';

import '@/components/charts/setup';
import { COLORS, type Marker } from '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { DistributionChart } from '@/components/charts/distribution-chart';
import { TornadoChart } from '@/components/charts/tornado-chart';
import { ConvergenceChart } from '@/components/charts/convergence-chart';
import { CriticalityChart } from '@/components/charts/criticality-chart';
import { CostFinishScatter } from '@/components/charts/cost-finish-scatter';
import { ResultCautions } from '@/components/ui/notice';
import type { SimulationResult, TotalSummary } from '@/lib/sim';
import type { RunView } from '@/lib/view-types/runs';
import { percentileCurve, topDrivers, type SampleCharts } from '@/lib/runs/outcome-data';
import { contingencyAt } from '@/lib/domain/contingency';
import { finishDate } from '@/lib/runs/working-days';
import {
  formatCount,
  formatDate,
  formatDays,
  formatMoney,
  formatMoneyShort,
  formatShare,
} from '@/lib/runs/format';
import { PercentileTable } from './outcome/percentile-table';
import { CorrelationsTable } from './outcome/correlations-table';
import { WarningsList } from './outcome/warnings-list';

export type OutcomeViewProps = {
  project: { id: number; code: string; currency: string; baseDate: string };
  run: RunView;
  result: SimulationResult;
  charts: SampleCharts | null;
  names: Record<string, string>;
};

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="space-y-3">
      <h2 className="border-b border-rule pb-1 text-base font-semibold">{title}</h2>
      {children}
    </section>
  );
}

function Figure({
  label,
  value,
  sub,
  testId,
}: {
  label: string;
  value: string;
  sub?: string;
  testId?: string;
}) {
  return (
    <div className="rounded border border-rule bg-paper-raised px-3 py-2">
      <p className="text-xs font-medium uppercase tracking-wide text-ink-soft">{label}</p>
      <p className="num text-left text-xl font-semibold" data-testid={testId}>
        {value}
      </p>
      {sub ? <p className="text-xs text-ink-faint">{sub}</p> : null}
    </div>
  );
}

/** Long schedules show their most critical activities only, so the chart stays readable. */
const MAX_CRITICALITY_ROWS = 20;

const ci = (c: [number, number], f: (v: number) => string) => `95 % interval ${f(c[0])} – ${f(c[1])}`;

export function OutcomeView({ project, run, result, charts, names }: OutcomeViewProps) {
  const currency = project.currency;
  const money = (v: number) => formatMoney(v, currency);
  const moneyShort = (v: number) => formatMoneyShort(v, currency);
  const dateOf = (days: number) => formatDate(finishDate(project.baseDate, days));
  const nameOf = (id: string) => names[id] ?? '';
  const s = run.settings;
  const level = s.confidence;
  const cost = result.cost;
  const duration = result.duration;
  const chosen = contingencyAt(cost, level);
  const sampleNote = charts
    ? charts.n < charts.of
      ? `Bars: the first ${formatCount(charts.n)} of the ${formatCount(charts.of)} iterations. Curve and markers: all iterations.`
      : `Bars, curve and markers: all ${formatCount(charts.of)} iterations.`
    : 'The curve runs through the percentiles of all iterations.';

  const costMarkers: Marker[] = [
    {
      value: cost.percentiles.P50,
      label: `P50 ${moneyShort(cost.percentiles.P50)}`,
      color: COLORS.ink,
      dash: [4, 3],
    },
    { value: cost.percentiles.P80, label: `P80 ${moneyShort(cost.percentiles.P80)}`, color: COLORS.cost },
    ...(s.costTarget !== null
      ? [
          {
            value: s.costTarget,
            label: `Target ${moneyShort(s.costTarget)}`,
            color: COLORS.caution,
            dash: [2, 2],
          },
        ]
      : []),
  ];
  const durationMarkers = (d: TotalSummary): Marker[] => [
    { value: d.percentiles.P50, label: `P50 ${dateOf(d.percentiles.P50)}`, color: COLORS.ink, dash: [4, 3] },
    { value: d.percentiles.P80, label: `P80 ${dateOf(d.percentiles.P80)}`, color: COLORS.time },
    ...(s.durationTarget !== null
      ? [
          {
            value: s.durationTarget,
            label: `Target ${dateOf(s.durationTarget)}`,
            color: COLORS.caution,
            dash: [2, 2],
          },
        ]
      : []),
  ];

  const costWithin = cost.probabilityWithinTarget;
  const durationWithin = duration?.probabilityWithinTarget;
  const allCriticality = Object.entries(result.criticality).sort(
    (a, b) => b[1] - a[1] || a[0].localeCompare(b[0]),
  );
  const criticality = allCriticality
    .slice(0, MAX_CRITICALITY_ROWS)
    .map(([id, value]) => ({ label: `${id} ${nameOf(id)}`.trim(), value }));

  return (
    <div className="space-y-6" data-testid="run-outcome">
      <div className="grid grid-cols-[1fr_320px] gap-4">
        <div className="grid grid-cols-4 gap-3">
          <Figure
            label="Cost P50"
            value={money(cost.percentiles.P50)}
            sub={ci(cost.percentileCI95.P50, money)}
            testId="cost-p50"
          />
          <Figure
            label="Cost P80"
            value={money(cost.percentiles.P80)}
            sub={ci(cost.percentileCI95.P80, money)}
            testId="cost-p80"
          />
          <Figure
            label={`Contingency at ${level}`}
            value={money(chosen.amount)}
            sub={`over the base of ${money(cost.base)}${chosen.shareOfBase !== null ? ` (${formatShare(chosen.shareOfBase)})` : ''}`}
            testId="contingency"
          />
          <Figure
            label="Cost within target"
            value={costWithin ? formatShare(costWithin.value) : '—'}
            sub={costWithin ? ci(costWithin.ci95, (v) => formatShare(v)) : 'No cost target was set.'}
          />
          {duration ? (
            <>
              <Figure
                label="Finish P50"
                value={dateOf(duration.percentiles.P50)}
                sub={`${formatDays(duration.percentiles.P50)} from ${formatDate(project.baseDate)}`}
              />
              <Figure
                label="Finish P80"
                value={dateOf(duration.percentiles.P80)}
                sub={`${formatDays(duration.percentiles.P80)}; interval ${dateOf(duration.percentileCI95.P80[0])} – ${dateOf(duration.percentileCI95.P80[1])}`}
                testId="finish-p80"
              />
              <Figure
                label="Finish within target"
                value={durationWithin ? formatShare(durationWithin.value) : '—'}
                sub={
                  durationWithin
                    ? ci(durationWithin.ci95, (v) => formatShare(v))
                    : 'No finish target was set.'
                }
              />
              <Figure
                label="Both targets met"
                value={result.joint ? formatShare(result.joint.probability) : '—'}
                sub={
                  result.joint
                    ? ci(result.joint.ci95, (v) => formatShare(v))
                    : 'Needs a cost and a finish target.'
                }
                testId="joint"
              />
            </>
          ) : null}
        </div>
        <ResultCautions />
      </div>

      <Section title="Cost">
        <div className="grid grid-cols-[1fr_480px] gap-4">
          <ChartFrame
            title="Total cost: distribution and S-curve"
            testId="chart-cost-histogram"
            reading={`80 % of simulated outcomes cost at most ${money(cost.percentiles.P80)}; half cost at most ${money(cost.percentiles.P50)}.`}
            note={sampleNote}
            height={300}
          >
            <DistributionChart
              hist={charts?.cost ?? { edges: [], counts: [], n: 1 }}
              curve={percentileCurve(cost)}
              markers={costMarkers}
              color={COLORS.cost}
              colorLight={COLORS.costLight}
              formatX={moneyShort}
              xTitle={`Total cost (${currency})`}
            />
          </ChartFrame>
          <div className="space-y-3 rounded border border-rule bg-paper-raised p-3">
            <PercentileTable
              summary={cost}
              format={money}
              caption="Cost P-table"
              withContingency
              testId="cost-ptable"
            />
            <p className="text-xs text-ink-soft">
              Contingency at the chosen {level}: <strong className="num">{money(chosen.amount)}</strong> over
              the base.
            </p>
          </div>
        </div>
      </Section>

      {duration ? (
        <Section title="Finish date">
          <div className="grid grid-cols-[1fr_480px] gap-4">
            <ChartFrame
              title="Finish date: distribution and S-curve"
              testId="chart-finish-curve"
              reading={`80 % of simulated outcomes finish by ${dateOf(duration.percentiles.P80)} (${formatDays(duration.percentiles.P80)} from the base date).`}
              note={`Working days Monday to Friday from the base date ${formatDate(project.baseDate)}. ${sampleNote}`}
              height={300}
            >
              <DistributionChart
                hist={charts?.duration ?? { edges: [], counts: [], n: 1 }}
                curve={percentileCurve(duration)}
                markers={durationMarkers(duration)}
                color={COLORS.time}
                colorLight={COLORS.timeLight}
                formatX={dateOf}
                xTitle="Finish date (working days from the base date)"
              />
            </ChartFrame>
            <div className="rounded border border-rule bg-paper-raised p-3">
              <PercentileTable
                summary={duration}
                format={(v) => formatDays(v)}
                caption="Duration P-table (working days)"
                extra={{ title: 'Finish', cell: dateOf }}
                testId="duration-ptable"
              />
            </div>
          </div>
        </Section>
      ) : null}

      <Section title="Targets">
        <div className="grid grid-cols-[400px_1fr] gap-4">
          <table className="h-fit w-full border-collapse rounded border border-rule bg-paper-raised text-sm">
            <thead className="text-xs text-ink-soft">
              <tr className="border-b border-rule">
                <th className="px-3 py-1.5 text-left font-medium">Probability of meeting</th>
                <th className="px-3 py-1.5 text-right font-medium">Value</th>
                <th className="px-3 py-1.5 text-right font-medium">95 % interval</th>
              </tr>
            </thead>
            <tbody>
              {[
                {
                  label: s.costTarget !== null ? `Cost ≤ ${money(s.costTarget)}` : 'Cost target (not set)',
                  p: costWithin ? { value: costWithin.value, ci95: costWithin.ci95 } : null,
                },
                {
                  label:
                    s.finishTarget !== null
                      ? `Finish by ${formatDate(s.finishTarget)}`
                      : 'Finish target (not set)',
                  p: durationWithin ? { value: durationWithin.value, ci95: durationWithin.ci95 } : null,
                },
                {
                  label: 'Both targets',
                  p: result.joint ? { value: result.joint.probability, ci95: result.joint.ci95 } : null,
                },
              ].map((row) => (
                <tr key={row.label} className="border-b border-rule/60">
                  <td className="px-3 py-1">{row.label}</td>
                  <td className="num px-3 py-1 font-semibold">{row.p ? formatShare(row.p.value) : '—'}</td>
                  <td className="num px-3 py-1 text-ink-soft">
                    {row.p ? `${formatShare(row.p.ci95[0])} – ${formatShare(row.p.ci95[1])}` : '—'}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {duration && charts && charts.scatter.length ? (
            <ChartFrame
              title="Cost against finish"
              testId="chart-scatter"
              reading={
                result.joint
                  ? `${formatShare(result.joint.probability)} of simulated outcomes meet both the cost and the finish target (lower left of the lines).`
                  : 'Set both a cost and a finish target to read the joint probability here.'
              }
              note={`One dot per iteration: ${formatCount(charts.scatter.length)} of the ${formatCount(charts.of)} iterations.`}
              height={300}
            >
              <CostFinishScatter
                points={charts.scatter}
                markers={[
                  ...(s.durationTarget !== null
                    ? [
                        {
                          value: s.durationTarget,
                          label: 'Finish target',
                          color: COLORS.caution,
                          axis: 'x' as const,
                        },
                      ]
                    : []),
                  ...(s.costTarget !== null
                    ? [
                        {
                          value: s.costTarget,
                          label: 'Cost target',
                          color: COLORS.caution,
                          axis: 'y' as const,
                        },
                      ]
                    : []),
                ]}
                formatX={dateOf}
                formatY={moneyShort}
              />
            </ChartFrame>
          ) : (
            <p className="text-sm text-ink-soft">
              The scatter of cost against finish needs a schedule (activities).
            </p>
          )}
        </div>
      </Section>

      <Section title="What drives the spread">
        <div className="grid grid-cols-2 gap-4">
          <ChartFrame
            title="Cost drivers (top 15)"
            testId="chart-tornado-cost"
            reading={
              result.sensitivity.cost.length
                ? `${topDrivers(result.sensitivity.cost, 1)[0].id} ${nameOf(topDrivers(result.sensitivity.cost, 1)[0].id)} moves the total cost most; the share after each name is its part of the variance.`
                : 'No uncertain input moves the cost.'
            }
            height={Math.max(160, topDrivers(result.sensitivity.cost).length * 22 + 50)}
          >
            <TornadoChart entries={topDrivers(result.sensitivity.cost)} nameOf={nameOf} color={COLORS.cost} />
          </ChartFrame>
          {duration ? (
            <ChartFrame
              title="Duration drivers (top 15)"
              testId="chart-tornado-duration"
              reading={
                result.sensitivity.duration.length
                  ? `${topDrivers(result.sensitivity.duration, 1)[0].id} ${nameOf(topDrivers(result.sensitivity.duration, 1)[0].id)} moves the finish most.`
                  : 'No uncertain input moves the finish.'
              }
              height={Math.max(160, topDrivers(result.sensitivity.duration).length * 22 + 50)}
            >
              <TornadoChart
                entries={topDrivers(result.sensitivity.duration)}
                nameOf={nameOf}
                color={COLORS.time}
              />
            </ChartFrame>
          ) : null}
        </div>
      </Section>

      <Section title="Convergence and criticality">
        <div className="grid grid-cols-2 gap-4">
          <ChartFrame
            title="Convergence of cost P50 and P80"
            testId="chart-convergence-cost"
            reading={`After ${formatCount(result.iterations)} iterations the cost P80 is known to within ${moneyShort(cost.percentileCI95.P80[1] - cost.percentileCI95.P80[0])} (95 % interval width).`}
            height={240}
          >
            <ConvergenceChart
              iterations={result.convergence.iterations}
              series={result.convergence.cost}
              color={COLORS.cost}
              band={COLORS.costBand}
              formatY={moneyShort}
              yTitle={`Total cost (${currency})`}
            />
          </ChartFrame>
          {duration && result.convergence.duration ? (
            <ChartFrame
              title="Convergence of duration P50 and P80"
              testId="chart-convergence-duration"
              reading={`The duration P80 is known to within ${formatDays(duration.percentileCI95.P80[1] - duration.percentileCI95.P80[0])} (95 % interval width).`}
              height={240}
            >
              <ConvergenceChart
                iterations={result.convergence.iterations}
                series={result.convergence.duration}
                color={COLORS.time}
                band={COLORS.timeBand}
                formatY={(v) => formatDays(v, 0)}
                yTitle="Duration (working days)"
              />
            </ChartFrame>
          ) : null}
          {criticality.length ? (
            <ChartFrame
              title="Criticality of activities"
              testId="chart-criticality"
              reading={`${criticality[0].label} is on the critical path in ${formatShare(criticality[0].value, 0)} of iterations.`}
              height={Math.max(140, criticality.length * 22 + 50)}
              note={
                allCriticality.length > criticality.length
                  ? `The ${criticality.length} most critical of ${allCriticality.length} activities.`
                  : undefined
              }
            >
              <CriticalityChart rows={criticality} />
            </ChartFrame>
          ) : null}
        </div>
      </Section>

      <Section title="Correlations">
        <CorrelationsTable rows={result.achievedCorrelations} nameOf={nameOf} />
      </Section>

      <Section title="Warnings">
        <WarningsList warnings={result.warnings} />
        <ResultCautions />
      </Section>
    </div>
  );
}
