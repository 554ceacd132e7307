'use client';

import { useState, type InputHTMLAttributes, type ReactNode } from 'react';
import { useRouter } from 'next/navigation';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '@/components/ui/button';
import { Field, Select, TextInput } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { HealthFindings } from '@/components/schedule/health-findings';
import type { HealthFinding } from '@/lib/domain/schedule-health';
import { ApiError, callApi } from '@/components/forms/api';
import {
  CONFIDENCE_LEVELS,
  DEFAULT_ITERATIONS,
  MAX_ITERATIONS,
  MAX_PRECISION_ITERATIONS,
  MAX_SEED,
  MIN_ITERATIONS,
  formToInput,
  runSettingsFormSchema,
  type RunSettingsForm,
} from '@/lib/validation/runs';
import type { RunView } from '@/lib/view-types/runs';
import { formatDate } from '@/lib/format';

const newSeed = () => 1 + Math.floor(Math.random() * MAX_SEED);
const id = (name: string) => `run-${name}`;

/** A typed field of the form; number inputs are read as numbers. */
type TextFieldSpec = {
  name: 'iterations' | 'relativePercent' | 'maxIterations' | 'seed' | 'costTarget' | 'finishTarget';
  id: string;
  label: string;
  hint: string;
  input: InputHTMLAttributes<HTMLInputElement>;
  /** A control to the right of the input. */
  beside?: ReactNode;
};

const SELECT_FIELDS: {
  name: 'sampling' | 'riskValues' | 'confidence';
  id: string;
  label: string;
  options: [string, string][];
}[] = [
  {
    name: 'sampling',
    id: 'sampling',
    label: 'Sampling',
    options: [
      ['lhs', 'Latin hypercube'],
      ['mc', 'Plain Monte Carlo'],
    ],
  },
  {
    name: 'riskValues',
    id: 'risk-values',
    label: 'Risk values',
    options: [
      ['pre', 'Pre-mitigation'],
      ['post', 'Post-mitigation'],
    ],
  },
  {
    name: 'confidence',
    id: 'confidence',
    label: 'Contingency at',
    options: CONFIDENCE_LEVELS.map((c) => [c, c]),
  },
];

/**
 * The settings of a new run. The seed is drawn at random but always shown (and stored), so the
 * run can be repeated exactly. The targets start as the project's own; changing or clearing them
 * here holds for this run only. On start the page moves to the run, which shows its progress.
 */
export function RunSettingsForm({
  projectId,
  initialSeed,
  baseDate,
  currency,
  health = null,
  targets = { cost: null, finish: null },
}: {
  projectId: number;
  initialSeed: number;
  baseDate: string;
  currency: string;
  /** The schedule's health check; a run may start whatever it finds. */
  health?: { findings: HealthFinding[]; activityCount: number } | null;
  /** The project's targets, offered as this run's (the user may change or clear them). */
  targets?: { cost: number | null; finish: string | null };
}) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<RunSettingsForm>({
    resolver: zodResolver(runSettingsFormSchema),
    defaultValues: {
      mode: 'fixed',
      iterations: DEFAULT_ITERATIONS,
      seed: initialSeed,
      sampling: 'lhs',
      riskValues: 'pre',
      costTarget: targets.cost === null ? '' : String(targets.cost),
      finishTarget: targets.finish ?? '',
      confidence: 'P80',
      relativePercent: 0.5,
      maxIterations: 200_000,
    },
  });
  const mode = useWatch({ control, name: 'mode' });

  async function onSubmit(values: RunSettingsForm) {
    setFailure(null);
    try {
      const { run } = await callApi<{ run: RunView }>(`/api/projects/${projectId}/runs`, {
        body: formToInput(values),
      });
      router.push(`/projects/${projectId}/runs/${run.id}`);
    } catch (e) {
      if (e instanceof ApiError) {
        const fieldOf: Record<string, keyof RunSettingsForm> = {
          'precision.relativePercent': 'relativePercent',
          'precision.maxIterations': 'maxIterations',
        };
        for (const issue of e.failure.issues) {
          const field = fieldOf[issue.path] ?? (issue.path as keyof RunSettingsForm);
          if (field in runSettingsFormSchema.shape) setError(field, { message: issue.message });
        }
        setFailure(e.message);
      } else setFailure('The run could not be started. Check your connection and try again.');
    }
  }

  const textFields: TextFieldSpec[] = [
    {
      name: 'iterations',
      id: 'iterations',
      label: mode === 'precision' ? 'First round (iterations)' : 'Iterations',
      hint: mode === 'precision' ? '1,000 to 1,000,000' : '1,000 to 10,000,000',
      input: {
        type: 'number',
        step: 1000,
        min: MIN_ITERATIONS,
        max: mode === 'precision' ? MAX_PRECISION_ITERATIONS : MAX_ITERATIONS,
      },
    },
    {
      name: 'relativePercent',
      id: 'relative',
      label: 'P80 known to ± (%)',
      hint: 'Relative half-width of its 95 % interval',
      input: { type: 'number', step: 0.1 },
    },
    {
      name: 'maxIterations',
      id: 'cap',
      label: 'Cap (iterations)',
      hint: 'Never more than this',
      input: { type: 'number', step: 1000 },
    },
    {
      name: 'costTarget',
      id: 'cost-target',
      label: `Cost target (${currency})`,
      hint:
        targets.cost === null ? 'Optional; e.g. the budget' : "The project's target; change it for this run",
      input: { inputMode: 'decimal' },
    },
    {
      name: 'finishTarget',
      id: 'finish-target',
      label: 'Finish target',
      hint:
        targets.finish === null
          ? `Optional; on or after the base date, ${formatDate(baseDate)}`
          : "The project's target; change it for this run",
      input: { type: 'date', min: baseDate },
    },
  ];
  const seedField: TextFieldSpec = {
    name: 'seed',
    id: 'seed',
    label: 'Seed',
    hint: 'Same seed, same result',
    input: { type: 'number' },
    beside: (
      <Button
        variant="secondary"
        onClick={() => setValue('seed', newSeed(), { shouldValidate: true })}
        aria-label="Draw a new seed"
        title="Draw a new seed"
      >
        New
      </Button>
    ),
  };
  const textField = (f: TextFieldSpec) => {
    const input = (
      <TextInput
        id={id(f.id)}
        {...f.input}
        invalid={!!errors[f.name]}
        {...register(f.name, { valueAsNumber: f.input.type === 'number' })}
      />
    );
    return (
      <Field key={f.name} id={id(f.id)} label={f.label} error={errors[f.name]?.message} hint={f.hint}>
        {f.beside ? (
          <div className="flex gap-1.5">
            {input}
            {f.beside}
          </div>
        ) : (
          input
        )}
      </Field>
    );
  };

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="space-y-4" aria-label="Run settings">
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium text-ink-soft">How long to run</legend>
        <div className="flex gap-5 text-sm">
          <label className="flex items-center gap-1.5">
            <input type="radio" value="fixed" {...register('mode')} /> A fixed number of iterations
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" value="precision" {...register('mode')} /> Until P80 is known to a precision
          </label>
        </div>
      </fieldset>
      <div className="grid grid-cols-4 gap-3">
        {textFields.slice(0, mode === 'precision' ? 3 : 1).map(textField)}
        {textField(seedField)}
      </div>
      <div className="grid grid-cols-4 gap-3">
        {SELECT_FIELDS.map((f) => (
          <Field key={f.name} id={id(f.id)} label={f.label}>
            <Select id={id(f.id)} {...register(f.name)}>
              {f.options.map(([value, label]) => (
                <option key={value} value={value}>
                  {label}
                </option>
              ))}
            </Select>
          </Field>
        ))}
        <div />
        {textFields.slice(3).map(textField)}
      </div>
      {health ? (
        <HealthFindings findings={health.findings} activityCount={health.activityCount} context="run" />
      ) : null}
      {failure ? (
        <Notice tone="invalid" title="The run was not started">
          {failure}
        </Notice>
      ) : null}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Starting…' : 'Start run'}
      </Button>
    </form>
  );
}
