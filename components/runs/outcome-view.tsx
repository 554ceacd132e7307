'use client';

import '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { CriticalityChart } from '@/components/charts/criticality-chart';
import { ResultCautions } from '@/components/ui/notice';
import type { SimulationResult } from '@/lib/sim';
import type { RunView } from '@/lib/view-types/runs';
import { criticalityRows, type SampleCharts } from '@/lib/runs/outcome-data';
import { allocationTable, byTopLevel } from '@/lib/runs/allocation';
import { contingencyAt } from '@/lib/domain/contingency';
import { calendarOfRun, calendarText, finishDate } from '@/lib/runs/working-days';
import {
  formatChange,
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
import { AllocationTable } from './outcome/allocation-table';
import { MitigationTable } from './outcome/mitigation-table';
import { DensityFrame, JointTables } from './outcome/joint-frames';
import { ConvergenceFrame, RankFrame, SCurveFrame, SwingFrame, type SideView } from './outcome/side-frames';

export type OutcomeViewProps = {
  project: { id: number; code: string; currency: string; baseDate: string };
  run: RunView;
  result: SimulationResult;
  charts: SampleCharts | null;
  /** Names of the model's line items, risks, activities and drivers, by code. */
  names: Record<string, string>;
};

/** A titled section; with `columns`, its children stand side by side in a grid of those columns. */
function Section({
  title,
  columns,
  children,
  testId,
}: {
  title: string;
  columns?: string;
  children: React.ReactNode;
  testId?: string;
}) {
  return (
    <section className="space-y-3" data-testid={testId}>
      <h2 className="border-b border-rule pb-1 text-base font-semibold">{title}</h2>
      {columns ? <div className={`grid ${columns} items-start gap-4`}>{children}</div> : children}
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

const ci = (c: [number, number], f: (v: number) => string) =>
  `95 % interval ${formatInterval(c[0], c[1], f)}`;

export function OutcomeView({ project, run, result, charts, names }: OutcomeViewProps) {
  const currency = project.currency;
  const money = (v: number) => formatMoney(v, currency);
  const moneyShort = (v: number) => formatMoneyShort(v, currency);
  const calendar = calendarOfRun(run.settings);
  const dateOf = (days: number) => formatDate(finishDate(project.baseDate, days, calendar));
  const days = (v: number) => formatDays(v);
  const nameOf = (id: string) => names[id] ?? '';
  const s = run.settings;
  const level = s.confidence;
  const cost = result.cost;
  const duration = result.duration;
  const chosen = contingencyAt(cost, level);
  const mitigation = result.mitigation;
  const scenario = mitigation
    ? mitigation.used === 'post'
      ? 'after the responses (post-mitigation, their cost included)'
      : 'before the responses (pre-mitigation)'
    : null;
  const sampleNote = charts
    ? charts.n < charts.of
      ? `Density strip: the first ${formatCount(charts.n)} of the ${formatCount(charts.of)} iterations. Curve and key: all iterations.`
      : `Strip, curve and key: all ${formatCount(charts.of)} iterations.`
    : 'The curve runs through the percentiles of all iterations.';

  const costWithin = cost.probabilityWithinTarget;
  const durationWithin = duration?.probabilityWithinTarget;
  const criticality = criticalityRows(result.criticality, result.sensitivity.duration).map((r) => ({
    ...r,
    label: `${r.id} ${nameOf(r.id)}`.trim(),
  }));
  const activities = Object.keys(result.criticality).length;
  const allocation = result.allocation ? allocationTable(result.allocation, nameOf) : null;
  const base = `/api/projects/${project.id}/runs/${run.id}/allocation`;

  return (
    <div className="space-y-6" data-testid="run-outcome">
      <div className="grid grid-cols-[1fr_320px] gap-4">
        <div className="space-y-3">
          {scenario ? (
            <p className="text-sm text-ink-soft" data-testid="scenario">
              Figures {scenario}.{' '}
              {mitigation ? `The section “Before and after the responses” compares the two scenarios.` : ''}
            </p>
          ) : null}
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
        </div>
        <ResultCautions />
      </div>

      <Section title="Cost" columns="grid-cols-[minmax(0,1fr)_400px]">
        <SCurveFrame
          view={costView()}
          strip={charts?.cost ?? null}
          mitigation={mitigation}
          level={level}
          reading={`${level.slice(1)} % of simulated outcomes cost at most ${money(cost.percentiles[level])}; half cost at most ${money(cost.percentiles.P50)}.`}
          note={sampleNote}
        />
        <div className="space-y-3 rounded border border-rule bg-paper-raised p-3">
          <PercentileTable
            summary={cost}
            format={money}
            caption="Cost P-table"
            withContingency
            level={level}
            testId="cost-ptable"
          />
          <p className="text-xs text-ink-soft">
            Contingency at the chosen {level}: <strong className="num">{money(chosen.amount)}</strong> over
            the base. The intervals measure only the simulation&apos;s own error, not the quality of the
            ranges entered.
          </p>
        </div>
      </Section>

      {mitigation ? (
        <Section title="Before and after the responses" columns="grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
          <div className="rounded border border-rule bg-paper-raised p-3">
            <MitigationTable mitigation={mitigation} level={level} money={money} days={days} />
          </div>
          <p className="text-sm text-ink-soft">
            Both scenarios come from the same iterations (the same random numbers), so the change is what the
            responses do, not sampling noise. At {level} the responses change the cost by{' '}
            <strong className="num">
              {formatChange(
                mitigation.post.cost.percentiles[level] - mitigation.pre.cost.percentiles[level],
                money,
              )}
            </strong>
            {mitigation.pre.duration && mitigation.post.duration ? (
              <>
                {' '}
                and the duration by{' '}
                <strong className="num">
                  {formatChange(
                    mitigation.post.duration.percentiles[level] - mitigation.pre.duration.percentiles[level],
                    days,
                  )}
                </strong>
              </>
            ) : null}
            , the responses&apos; own cost included. The S-curves above and below draw both scenarios.
          </p>
        </Section>
      ) : null}

      {duration ? (
        <Section title="Finish date" columns="grid-cols-[minmax(0,1fr)_400px]">
          <SCurveFrame
            view={{
              side: 'duration',
              summary: duration,
              target: s.durationTarget,
              format: dateOf,
              formatAmount: days,
              axisTitle: `Finish date (working days ${calendarText(calendar)} from the base date)`,
            }}
            strip={charts?.duration ?? null}
            mitigation={mitigation}
            level={level}
            reading={`${level.slice(1)} % of simulated outcomes finish by ${dateOf(duration.percentiles[level])} (${formatDays(duration.percentiles[level])} from the base date).`}
            note={`Working days ${calendarText(calendar)}, from the base date ${formatDate(project.baseDate)}. ${sampleNote}`}
          />
          <div className="rounded border border-rule bg-paper-raised p-3">
            <PercentileTable
              summary={duration}
              format={(v) => formatDays(v)}
              caption="Duration P-table (working days)"
              extra={{ title: 'Finish', cell: dateOf }}
              level={level}
              testId="duration-ptable"
            />
          </div>
        </Section>
      ) : null}

      <Section title="Targets and joint confidence" columns="grid-cols-[minmax(0,1fr)_360px]">
        {duration && charts && charts.scatter.length ? (
          <DensityFrame
            result={result}
            points={charts.scatter}
            iterations={charts.of}
            targets={{ duration: s.durationTarget, cost: s.costTarget }}
            formatX={dateOf}
            formatY={moneyShort}
            formatShare={(v) => formatShare(v)}
            formatCount={formatCount}
            currency={currency}
          />
        ) : (
          <p className="text-sm text-ink-soft">
            {duration
              ? 'The density of cost against finish needs the run’s sample of iterations, which this run does not hold.'
              : 'The density of cost against finish needs a schedule (activities).'}
          </p>
        )}
        <div className="space-y-3 rounded border border-rule bg-paper-raised p-3">
          <table className="w-full border-collapse text-sm">
            <caption className="pb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
              The run&apos;s targets
            </caption>
            <thead className="text-xs text-ink-soft">
              <tr className="border-b border-rule">
                <th className="py-1 pr-2 text-left font-medium">Probability of meeting</th>
                <th className="py-1 pl-2 text-right font-medium">Value (95 % interval)</th>
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
                  <td className="py-0.5 pr-2">{row.label}</td>
                  <td className="num py-0.5 pl-2">
                    <span className="font-semibold">{row.p ? formatShare(row.p.value) : '—'}</span>
                    {row.p ? (
                      <span className="block text-2xs text-ink-faint">
                        {formatShare(row.p.ci95[0])} – {formatShare(row.p.ci95[1])}
                      </span>
                    ) : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          {duration ? (
            <JointTables
              joint={result.joint}
              formatShare={(v) => formatShare(v)}
              formatDate={dateOf}
              money={money}
            />
          ) : null}
        </div>
      </Section>

      <Section title="What moves the cost" columns="grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <SwingFrame
          side="cost"
          entries={result.sensitivity.cost}
          mean={cost.mean}
          nameOf={nameOf}
          formatDelta={(v) => formatChange(v, moneyShort)}
          unit={currency}
        />
        <RankFrame side="cost" entries={result.sensitivity.cost} nameOf={nameOf} />
      </Section>

      {duration ? (
        <Section title="What moves the finish" columns="grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
          <SwingFrame
            side="duration"
            entries={result.sensitivity.duration}
            mean={duration.mean}
            nameOf={nameOf}
            formatDelta={(v) => formatChange(v, (d) => formatDays(d, 1))}
            formatTick={(v) => formatChange(v, (d) => formatDays(d, 0))}
            unit="working days"
          />
          <RankFrame side="duration" entries={result.sensitivity.duration} nameOf={nameOf} />
        </Section>
      ) : null}

      <Section title={`Where the contingency sits`} testId="allocation">
        {allocation ? (
          <AllocationTable
            table={allocation}
            grouped={byTopLevel(allocation, nameOf)}
            chosen={level}
            money={money}
            share={(v) => formatShare(v)}
            download={{ csv: `${base}?format=csv`, xlsx: `${base}?format=xlsx` }}
          />
        ) : (
          <p className="text-sm text-ink-soft">
            This run was made before results held the allocation of contingency; run it again to see it.
          </p>
        )}
      </Section>

      <Section
        title={duration ? 'Criticality and convergence' : 'Convergence'}
        columns="grid-cols-[minmax(0,1fr)_minmax(0,1fr)]"
      >
        {duration && criticality.length ? (
          <ChartFrame
            title="Criticality and schedule sensitivity index"
            testId="chart-criticality"
            reading={`${criticality[0].label} is on the critical path in ${formatShare(criticality[0].criticality, 0)} of iterations${criticality[0].ssi !== null ? `; its sensitivity index is ${formatShare(criticality[0].ssi, 0)}` : ''}.`}
            height={Math.max(160, criticality.length * 26 + 70)}
            note={
              <>
                {criticality.some((r) => r.ssi !== null)
                  ? 'Sensitivity index: criticality × the spread of the activity’s duration ÷ the spread of the project’s. '
                  : 'This run was made before results held the schedule sensitivity index. '}
                {activities > criticality.length
                  ? `The ${criticality.length} most critical of ${activities} activities.`
                  : ''}
              </>
            }
          >
            <CriticalityChart rows={criticality} />
          </ChartFrame>
        ) : null}
        <div className="space-y-4">
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

  function costView(): SideView {
    return {
      side: 'cost',
      summary: cost,
      target: s.costTarget,
      format: moneyShort,
      formatAmount: moneyShort,
      axisTitle: `Total cost (${currency})`,
    };
  }
}
