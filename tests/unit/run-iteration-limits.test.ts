// The iteration limits of a run's settings: up to 10,000,000 iterations (bounded runs), while a
// run to a precision goal, which keeps every iteration in memory, stays capped at 1,000,000.
import { describe, expect, it } from 'vitest';
import { runSettingsFormSchema, runSettingsInputSchema } from '@/lib/validation/runs';

const issues = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  r.success ? [] : r.error!.issues.map((i) => `${i.path.join('.')}: ${i.message}`);

describe('iteration limits', () => {
  it('accepts 10,000,000 iterations and refuses one more', () => {
    expect(runSettingsInputSchema.safeParse({ iterations: 10_000_000 }).success).toBe(true);
    expect(issues(runSettingsInputSchema.safeParse({ iterations: 10_000_001 }))).toEqual([
      'iterations: Enter a whole number of iterations from 1,000 to 10,000,000.',
    ]);
  });

  it('keeps a precision goal’s first round and cap at 1,000,000', () => {
    const goal = (iterations: number, maxIterations: number) =>
      runSettingsInputSchema.safeParse({ iterations, precision: { relativePercent: 1, maxIterations } });
    expect(goal(10_000, 1_000_000).success).toBe(true);
    expect(issues(goal(10_000, 2_000_000))).toEqual([
      'precision.maxIterations: Enter a whole number of iterations from 1,000 to 1,000,000 for a run to a precision goal.',
    ]);
    expect(issues(goal(2_000_000, 2_000_000))).toContain(
      'iterations: Enter a whole number of iterations from 1,000 to 1,000,000 for a run to a precision goal.',
    );
  });

  it('checks the form the same way in each mode', () => {
    const form = {
      mode: 'fixed' as const,
      iterations: 5_000_000,
      seed: 1,
      sampling: 'lhs' as const,
      riskValues: 'pre' as const,
      costTarget: '',
      finishTarget: '',
      confidence: 'P80' as const,
      relativePercent: 1,
      maxIterations: 200_000,
    };
    expect(runSettingsFormSchema.safeParse(form).success).toBe(true);
    expect(
      issues(runSettingsFormSchema.safeParse({ ...form, mode: 'precision', maxIterations: 5_000_000 })),
    ).toEqual([
      'iterations: Enter a whole number of iterations from 1,000 to 1,000,000 for a run to a precision goal.',
      'maxIterations: Enter a whole number of iterations from 1,000 to 1,000,000 for a run to a precision goal.',
    ]);
  });
});
