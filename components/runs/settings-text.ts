import type { RunSettings } from '@/lib/validation/runs';

/** "10,000 iterations · LHS · seed 42 · pre-mitigation · P80" */
export function settingsText(s: RunSettings): string {
  const iterations = s.precision
    ? `until P80 ±${s.precision.relativePercent} % (cap ${s.precision.maxIterations.toLocaleString('en-GB')})`
    : `${s.iterations.toLocaleString('en-GB')} iterations`;
  return [
    iterations,
    s.sampling === 'lhs' ? 'LHS' : 'Monte Carlo',
    `seed ${s.seed}`,
    s.riskValues === 'pre' ? 'pre-mitigation' : 'post-mitigation',
    `contingency at ${s.confidence}`,
  ].join(' · ');
}
