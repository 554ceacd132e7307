'use client';

import '@/components/charts/setup';
import { ChartFrame } from '@/components/charts/chart-frame';
import { SCurveCompare } from '@/components/charts/s-curve-compare';
import { ResultCautions } from '@/components/ui/notice';
import type { PercentileKey, SimulationResult, TotalSummary } from '@/lib/sim';
import type { RunView } from '@/lib/view-types/runs';
import type { SnapshotDiff } from '@/lib/runs/snapshot-diff';
import { percentileCurve } from '@/lib/runs/outcome-data';
import { calendarOfRun, finishDate } from '@/lib/runs/working-days';
import {
  formatChange,
  formatDate,
  formatDateTime,
  formatDays,
  formatMoney,
  formatMoneyShort,
  formatNumber,
  formatPercent,
} from '@/lib/runs/format';
import { diffValueText, fieldLabel } from '@/lib/runs/diff-text';
import { TableHead, type HeadCell } from '@/components/ui/table';
import { settingsText } from './settings-text';

type Side = { run: RunView; result: SimulationResult };

const LEVELS: PercentileKey[] = ['P10', 'P50', 'P80', 'P90'];
const KIND_LABEL = {
  item: 'Line item',
  risk: 'Risk event',
  activity: 'Activity',
  driver: 'Driver',
  correlation: 'Correlation',
};

const VALUES_HEAD: HeadCell[] = [
  'Level',
  ...['Older', 'Newer', 'Change'].map((title) => ({ title, align: 'right' as const })),
];

function ValuesTable({
  title,
  a,
  b,
  format,
}: {
  title: string;
  a: TotalSummary;
  b: TotalSummary;
  format: (v: number) => string;
}) {
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="pb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
        {title}
      </caption>
      <TableHead look="captioned" cells={VALUES_HEAD} />
      <tbody>
        {(['base', ...LEVELS] as const).map((k) => {
          const va = k === 'base' ? a.base : a.percentiles[k];
          const vb = k === 'base' ? b.base : b.percentiles[k];
          return (
            <tr key={k} className="border-b border-rule/60">
              <td className="py-0.5">{k === 'base' ? 'Base' : k}</td>
              <td className="num py-0.5">{format(va)}</td>
              <td className="num py-0.5">{format(vb)}</td>
              <td className="num py-0.5">{formatChange(vb - va, format)}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/** The chances each run gives of meeting its targets, as percentages; absent when no target was set. */
function ChancesTable({ older, newer }: { older: SimulationResult; newer: SimulationResult }) {
  const rows = [
    ['Cost within its target', (r: SimulationResult) => r.cost.probabilityWithinTarget?.value],
    ['Finish within its target', (r: SimulationResult) => r.duration?.probabilityWithinTarget?.value],
    ['Both targets met', (r: SimulationResult) => r.joint?.probability],
  ] as const;
  const shown = rows.filter(([, pick]) => pick(older) !== undefined || pick(newer) !== undefined);
  if (!shown.length) return null;
  const pct = (v: number | undefined) => (v === undefined ? '—' : formatPercent(v));
  return (
    <table className="w-full border-collapse text-sm" data-testid="compare-chances">
      <caption className="pb-1 text-left text-xs font-semibold uppercase tracking-wide text-ink-soft">
        Chance of meeting the targets
      </caption>
      <TableHead look="captioned" cells={VALUES_HEAD} />
      <tbody>
        {shown.map(([label, pick]) => {
          const va = pick(older);
          const vb = pick(newer);
          return (
            <tr key={label} className="border-b border-rule/60">
              <td className="py-0.5">{label}</td>
              <td className="num py-0.5">{pct(va)}</td>
              <td className="num py-0.5">{pct(vb)}</td>
              <td className="num py-0.5">
                {va === undefined || vb === undefined
                  ? '—'
                  : formatChange(vb - va, (v) => `${formatNumber(v * 100, 1, 1)} points`)}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

export function CompareView({
  project,
  a,
  b,
  diff,
}: {
  project: { currency: string; baseDate: string };
  a: Side;
  b: Side;
  diff: SnapshotDiff;
}) {
  const money = (v: number) => formatMoney(v, project.currency);
  const moneyShort = (v: number) => formatMoneyShort(v, project.currency);
  const [older, newer] = a.run.id < b.run.id ? [a, b] : [b, a];
  // Both runs' days become dates on the newer run's calendar, so that one axis serves both.
  const dateOf = (d: number) =>
    formatDate(finishDate(project.baseDate, d, calendarOfRun(newer.run.settings)));
  const labels: [string, string] = [`Run ${older.run.number}`, `Run ${newer.run.number}`];
  const show = (line: Parameters<typeof diffValueText>[0], field: string, v: unknown) =>
    diffValueText(line, field, v, project.currency);
  const dA = older.result.duration;
  const dB = newer.result.duration;
  const p80Change = newer.result.cost.percentiles.P80 - older.result.cost.percentiles.P80;
  return (
    <div className="space-y-5" data-testid="run-compare">
      <div className="grid grid-cols-[1fr_320px] gap-4">
        <div className="grid grid-cols-2 gap-3 text-sm">
          {[older, newer].map((s) => (
            <p key={s.run.id} className="rounded border border-rule bg-paper-raised px-3 py-2">
              <strong>Run {s.run.number}</strong> · {formatDateTime(s.run.createdAt)} ·{' '}
              {s.run.startedBy?.name ?? '—'}
              <br />
              <span className="text-xs text-ink-soft">{settingsText(s.run.settings)}</span>
            </p>
          ))}
        </div>
        <ResultCautions />
      </div>
      <div className="grid grid-cols-2 gap-4">
        <div className="space-y-4 rounded border border-rule bg-paper-raised p-3">
          <ValuesTable title="Cost" a={older.result.cost} b={newer.result.cost} format={money} />
          {dA && dB ? (
            <ValuesTable title="Duration (working days)" a={dA} b={dB} format={(v) => formatDays(v)} />
          ) : null}
          <ChancesTable older={older.result} newer={newer.result} />
        </div>
        <ChartFrame
          title="Cost S-curves"
          reading={`The cost P80 moved by ${formatChange(p80Change, money)} from run ${older.run.number} to run ${newer.run.number}.`}
          height={260}
        >
          <SCurveCompare
            a={percentileCurve(older.result.cost)}
            b={percentileCurve(newer.result.cost)}
            labels={labels}
            formatX={moneyShort}
            xTitle={`Total cost (${project.currency})`}
          />
        </ChartFrame>
        {dA && dB ? (
          <ChartFrame
            title="Finish-date S-curves"
            reading={
              dateOf(dA.percentiles.P80) === dateOf(dB.percentiles.P80)
                ? `The P80 finish stays at ${dateOf(dB.percentiles.P80)}.`
                : `The P80 finish moved from ${dateOf(dA.percentiles.P80)} to ${dateOf(dB.percentiles.P80)}.`
            }
            height={260}
          >
            <SCurveCompare
              a={percentileCurve(dA)}
              b={percentileCurve(dB)}
              labels={labels}
              formatX={dateOf}
              xTitle="Finish date (working days from the base date)"
            />
          </ChartFrame>
        ) : null}
      </div>
      <section className="space-y-2">
        <h2 className="border-b border-rule pb-1 text-base font-semibold">What changed in the inputs</h2>
        {diff.lines.length === 0 && diff.other.length === 0 ? (
          <p className="text-sm text-ink-soft">Both runs read the same inputs and settings.</p>
        ) : (
          <table
            className="w-full border-collapse rounded border border-rule bg-paper-raised text-sm"
            data-testid="input-changes"
          >
            <thead className="bg-paper-sunk text-left text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th className="px-3 py-1.5">Change</th>
                <th className="px-3 py-1.5">Line</th>
                <th className="px-3 py-1.5">Field</th>
                <th className="px-3 py-1.5">Run {older.run.number}</th>
                <th className="px-3 py-1.5">Run {newer.run.number}</th>
              </tr>
            </thead>
            <tbody>
              {diff.lines.flatMap((l) =>
                (l.fields.length ? l.fields : [null]).map((f, i) => (
                  <tr
                    key={`${l.kind}-${l.id}-${i}`}
                    className="border-t border-rule align-top"
                    data-change={l.change}
                  >
                    <td className="px-3 py-1">{i === 0 ? l.change : ''}</td>
                    <td className="px-3 py-1">
                      {i === 0 ? (
                        <>
                          {KIND_LABEL[l.kind]} <strong>{l.id}</strong>{' '}
                          {l.name ? <span className="text-ink-soft">{l.name}</span> : null}
                        </>
                      ) : null}
                    </td>
                    <td className="px-3 py-1">{f ? fieldLabel(f.field) : ''}</td>
                    <td className="num px-3 py-1 text-left">{f ? show(l.kind, f.field, f.before) : ''}</td>
                    <td className="num px-3 py-1 text-left">{f ? show(l.kind, f.field, f.after) : ''}</td>
                  </tr>
                )),
              )}
              {diff.other.map((o) => (
                <tr key={o.field} className="border-t border-rule align-top" data-change="settings">
                  <td className="px-3 py-1">changed</td>
                  <td className="px-3 py-1">The run’s {fieldLabel(o.field).toLowerCase()}</td>
                  <td className="px-3 py-1" />
                  <td className="num px-3 py-1 text-left">{show('run', o.field, o.before)}</td>
                  <td className="num px-3 py-1 text-left">{show('run', o.field, o.after)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}
