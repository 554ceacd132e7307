'use client';

import '@/components/charts/setup';
import { COLORS } from '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { CriticalityChart } from '@/components/charts/criticality-chart';
import { CostFinishScatter } from '@/components/charts/cost-finish-scatter';
import { ResultCautions } from '@/components/ui/notice';
import type { SimulationResult } from '@/lib/sim';
import type { RunView } from '@/lib/view-types/runs';
import type { SampleCharts } from '@/lib/runs/outcome-data';
import { contingencyAt } from '@/lib/domain/contingency';
import { finishDate } from '@/lib/runs/working-days';
import {
  formatCount,
  formatDate,
  formatDays,
  formatMoney,
  formatMoneyShort,
  formatInterval,
  formatShare,
} from '@/lib/runs/format';
import { PercentileTable } from './outcome/percentile-table';
import { CorrelationsTable } from './outcome/correlations-table';
import { WarningsList } from './outcome/warnings-list';
import { ConvergenceFrame, DistributionFrame, DriversFrame, type SideView } from './outcome/side-frames';

export type OutcomeViewProps = {
  project: { id: number; code: string; currency: string; baseDate: string };
  run: RunView;
  result: SimulationResult;
  charts: SampleCharts | null;
  names: Record<string, string>;
};

/** A titled section; with `columns`, its children stand side by side in a grid of those columns. */
function Section({
  title,
  columns,
  children,
}: {
  title: string;
  columns?: string;
  children: React.ReactNode;
}) {
  return (
    <section className="space-y-3">
      <h2 className="border-b border-rule pb-1 text-base font-semibold">{title}</h2>
      {columns ? <div className={`grid ${columns} gap-4`}>{children}</div> : children}
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

const ci = (c: [number, number], f: (v: number) => string) =>
  `95 % interval ${formatInterval(c[0], c[1], f)}`;

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

  const costView: SideView = {
    side: 'cost',
    summary: cost,
    target: s.costTarget,
    format: moneyShort,
    axisTitle: `Total cost (${currency})`,
  };

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
                sub={`${formatDays(duration.percentiles.P80)}; interval ${formatInterval(duration.percentileCI95.P80[0], duration.percentileCI95.P80[1], dateOf)}`}
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

      <Section title="Cost" columns="grid-cols-[1fr_480px]">
        <DistributionFrame
          view={costView}
          charts={charts}
          reading={`80 % of simulated outcomes cost at most ${money(cost.percentiles.P80)}; half cost at most ${money(cost.percentiles.P50)}.`}
          note={sampleNote}
        />
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
      </Section>

      {duration ? (
        <Section title="Finish date" columns="grid-cols-[1fr_480px]">
          <DistributionFrame
            view={{
              side: 'duration',
              summary: duration,
              target: s.durationTarget,
              format: dateOf,
              axisTitle: 'Finish date (working days from the base date)',
            }}
            charts={charts}
            reading={`80 % of simulated outcomes finish by ${dateOf(duration.percentiles.P80)} (${formatDays(duration.percentiles.P80)} from the base date).`}
            note={`Working days Monday to Friday from the base date ${formatDate(project.baseDate)}. ${sampleNote}`}
          />
          <div className="rounded border border-rule bg-paper-raised p-3">
            <PercentileTable
              summary={duration}
              format={(v) => formatDays(v)}
              caption="Duration P-table (working days)"
              extra={{ title: 'Finish', cell: dateOf }}
              testId="duration-ptable"
            />
          </div>
        </Section>
      ) : null}

      <Section title="Targets" columns="grid-cols-[400px_1fr]">
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
                  {row.p ? formatInterval(row.p.ci95[0], row.p.ci95[1], (v) => formatShare(v)) : '—'}
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
      </Section>

      <Section title="What drives the spread" columns="grid-cols-2">
        <DriversFrame
          side="cost"
          entries={result.sensitivity.cost}
          nameOf={nameOf}
          reading={(d) =>
            `${d} moves the total cost most; the share after each name is its part of the variance.`
          }
          empty="No uncertain input moves the cost."
        />
        {duration ? (
          <DriversFrame
            side="duration"
            entries={result.sensitivity.duration}
            nameOf={nameOf}
            reading={(d) => `${d} moves the finish most.`}
            empty="No uncertain input moves the finish."
          />
        ) : null}
      </Section>

      <Section title="Convergence and criticality" columns="grid-cols-2">
        <ConvergenceFrame
          side="cost"
          convergence={result.convergence}
          reading={`After ${formatCount(result.iterations)} iterations the cost P80 is known to within ${moneyShort(cost.percentileCI95.P80[1] - cost.percentileCI95.P80[0])} (95 % interval width).`}
          formatY={moneyShort}
          yTitle={`Total cost (${currency})`}
        />
        {duration ? (
          <ConvergenceFrame
            side="duration"
            convergence={result.convergence}
            reading={`The duration P80 is known to within ${formatDays(duration.percentileCI95.P80[1] - duration.percentileCI95.P80[0])} (95 % interval width).`}
            formatY={(v) => formatDays(v, 0)}
            yTitle="Duration (working days)"
          />
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
