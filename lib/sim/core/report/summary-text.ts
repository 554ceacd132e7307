// A short human summary of a result, for the command line: P50/P80/P90 of cost and duration
// with the base, contingency and intervals, the chance of meeting targets, the comparison before
// and after mitigation, the top drivers, the most critical activities and the warnings.

import type { SimulationResult, TotalSummary } from '../formats';

const money = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const days = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1, minimumFractionDigits: 1 });
const pct = (x: number) => `${(100 * x).toFixed(1)}%`;
const signed = (s: string, x: number) => (x >= 0 ? `+${s}` : s);

function totalBlock(
  title: string,
  t: TotalSummary,
  f: Intl.NumberFormat,
  target: number | undefined,
): string[] {
  const keys = ['P50', 'P80', 'P90'] as const;
  const rows: [string, string[]][] = [
    [title, ['base', ...keys]],
    ['  value', [f.format(t.base), ...keys.map((k) => f.format(t.percentiles[k]))]],
    ['  contingency', ['', ...keys.map((k) => signed(f.format(t.contingency[k]), t.contingency[k]))]],
    [
      '  95% interval',
      ['', ...keys.map((k) => `${f.format(t.percentileCI95[k][0])}–${f.format(t.percentileCI95[k][1])}`)],
    ],
  ];
  // Each column as wide as its widest cell (an interval of large sums is wider than a value).
  const widths = rows[0][1].map((_, c) => Math.max(14, ...rows.map(([, cells]) => cells[c].length + 2)));
  const lines = [
    ...rows.map(
      ([label, cells]) => `${label.padEnd(18)}${cells.map((x, c) => x.padStart(widths[c])).join('')}`,
    ),
    `  mean ${f.format(t.mean)}, sd ${f.format(t.sd)}, range ${f.format(t.min)} – ${f.format(t.max)}`,
  ];
  if (t.probabilityWithinTarget && target !== undefined) {
    const p = t.probabilityWithinTarget;
    lines.push(
      `  within target ${f.format(target)}: ${pct(p.value)} (95% interval ${pct(p.ci95[0])}–${pct(p.ci95[1])})`,
    );
  }
  return lines;
}

export interface SummaryContext {
  name?: string;
  currency?: string;
  threads: number;
  targets?: { cost?: number; duration?: number };
}

export function summaryText(r: SimulationResult, ctx: SummaryContext): string {
  const lines: string[] = [];
  lines.push(`${ctx.name ?? 'Model'}${ctx.currency ? ` (${ctx.currency})` : ''}`);
  lines.push(
    `${money.format(r.iterations)} iterations, ${r.sampling === 'lhs' ? 'Latin hypercube' : 'Monte Carlo'}, ` +
      `seed ${r.seed}, ${ctx.threads} thread${ctx.threads === 1 ? '' : 's'}, ${(r.elapsedMs / 1000).toFixed(2)} s`,
  );
  lines.push('');
  lines.push(
    ...totalBlock(`Cost${ctx.currency ? ` (${ctx.currency})` : ''}`, r.cost, money, ctx.targets?.cost),
  );
  if (r.duration) {
    lines.push('');
    lines.push(...totalBlock('Duration (days)', r.duration, days, ctx.targets?.duration));
  }
  if (r.joint) {
    lines.push('');
    lines.push(
      `Both targets met: ${pct(r.joint.probability)} (95% interval ${pct(r.joint.ci95[0])}–${pct(r.joint.ci95[1])})`,
    );
  }
  if (r.mitigation) lines.push('', ...mitigationBlock(r.mitigation, ctx.currency));
  const drivers = (list: SimulationResult['sensitivity']['cost']) =>
    list
      .slice(0, 5)
      .map(
        (d) =>
          `${d.id}${d.kind ? ` [${d.kind}]` : ''} (ρ ${d.rankCorrelation.toFixed(2)}, ${pct(d.varianceShare)})`,
      )
      .join(', ');
  lines.push('');
  if (r.sensitivity.cost.length) lines.push(`Top cost drivers: ${drivers(r.sensitivity.cost)}`);
  if (r.sensitivity.duration.length) lines.push(`Top schedule drivers: ${drivers(r.sensitivity.duration)}`);
  if (r.sensitivity.cost.length || r.sensitivity.duration.length)
    lines.push(
      '  (ρ: rank correlation with the total; %: share of the explained rank variance, not of money)',
    );
  const critical = Object.entries(r.criticality)
    .sort((a, b) => b[1] - a[1])
    .slice(0, 5);
  if (critical.length)
    lines.push(`Most critical: ${critical.map(([id, c]) => `${id} ${pct(c)}`).join(', ')}`);
  if (r.warnings.length) {
    lines.push('');
    lines.push('Warnings:');
    for (const w of r.warnings) lines.push(`  - ${w}`);
  }
  return lines.join('\n');
}

function mitigationBlock(m: NonNullable<SimulationResult['mitigation']>, currency?: string): string[] {
  const col = (s: string) => s.padStart(14);
  const row = (label: string, pre: number, post: number, f: Intl.NumberFormat) =>
    `${label.padEnd(18)}${col(f.format(pre))}${col(f.format(post))}${col(signed(f.format(post - pre), post - pre))}`;
  const lines = [
    `Mitigation (headline: ${m.used === 'post' ? 'after' : 'before'} mitigation)`,
    `${''.padEnd(18)}${col('before')}${col('after')}${col('change')}`,
  ];
  const c = (k: 'P50' | 'P80' | 'P90') =>
    row(`  cost ${k}`, m.pre.cost.percentiles[k], m.post.cost.percentiles[k], money);
  lines.push(row(`  cost mean${currency ? ` (${currency})` : ''}`, m.pre.cost.mean, m.post.cost.mean, money));
  lines.push(c('P50'), c('P80'), c('P90'));
  if (m.pre.duration && m.post.duration) {
    lines.push(row('  duration mean', m.pre.duration.mean, m.post.duration.mean, days));
    lines.push(row('  duration P80', m.pre.duration.percentiles.P80, m.post.duration.percentiles.P80, days));
  }
  return lines;
}
