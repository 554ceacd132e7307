'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '@/components/ui/button';
import { Field, Select, TextInput } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from '@/components/forms/api';
import {
  CONFIDENCE_LEVELS,
  DEFAULT_ITERATIONS,
  MAX_SEED,
  formToInput,
  runSettingsFormSchema,
  type RunSettingsForm,
} from '@/lib/validation/runs';
import type { RunView } from '@/lib/view-types/runs';

const newSeed = () => 1 + Math.floor(Math.random() * MAX_SEED);

/**
 * The settings of a new run. The seed is drawn at random but always shown (and stored), so the
 * run can be repeated exactly. On start the page moves to the run, which shows its progress.
 */
export function RunSettingsForm({
  projectId,
  initialSeed,
  baseDate,
  currency,
}: {
  projectId: number;
  initialSeed: number;
  baseDate: string;
  currency: string;
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
      costTarget: '',
      finishTarget: '',
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

  const id = (name: string) => `run-${name}`;
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
        <Field
          id={id('iterations')}
          label={mode === 'precision' ? 'First round (iterations)' : 'Iterations'}
          error={errors.iterations?.message}
          hint="1,000 to 1,000,000"
        >
          <TextInput
            id={id('iterations')}
            type="number"
            step={1000}
            min={1000}
            max={1_000_000}
            invalid={!!errors.iterations}
            {...register('iterations', { valueAsNumber: true })}
          />
        </Field>
        {mode === 'precision' ? (
          <>
            <Field
              id={id('relative')}
              label="P80 known to ± (%)"
              error={errors.relativePercent?.message}
              hint="Relative half-width of its 95 % interval"
            >
              <TextInput
                id={id('relative')}
                type="number"
                step={0.1}
                invalid={!!errors.relativePercent}
                {...register('relativePercent', { valueAsNumber: true })}
              />
            </Field>
            <Field
              id={id('cap')}
              label="Cap (iterations)"
              error={errors.maxIterations?.message}
              hint="Never more than this"
            >
              <TextInput
                id={id('cap')}
                type="number"
                step={1000}
                invalid={!!errors.maxIterations}
                {...register('maxIterations', { valueAsNumber: true })}
              />
            </Field>
          </>
        ) : null}
        <Field id={id('seed')} label="Seed" error={errors.seed?.message} hint="Same seed, same result">
          <div className="flex gap-1.5">
            <TextInput
              id={id('seed')}
              type="number"
              invalid={!!errors.seed}
              {...register('seed', { valueAsNumber: true })}
            />
            <Button
              variant="secondary"
              onClick={() => setValue('seed', newSeed(), { shouldValidate: true })}
              aria-label="Draw a new seed"
              title="Draw a new seed"
            >
              New
            </Button>
          </div>
        </Field>
      </div>
      <div className="grid grid-cols-4 gap-3">
        <Field id={id('sampling')} label="Sampling">
          <Select id={id('sampling')} {...register('sampling')}>
            <option value="lhs">Latin hypercube</option>
            <option value="mc">Plain Monte Carlo</option>
          </Select>
        </Field>
        <Field id={id('risk-values')} label="Risk values">
          <Select id={id('risk-values')} {...register('riskValues')}>
            <option value="pre">Pre-mitigation</option>
            <option value="post">Post-mitigation</option>
          </Select>
        </Field>
        <Field id={id('confidence')} label="Contingency at">
          <Select id={id('confidence')} {...register('confidence')}>
            {CONFIDENCE_LEVELS.map((c) => (
              <option key={c} value={c}>
                {c}
              </option>
            ))}
          </Select>
        </Field>
        <div />
        <Field
          id={id('cost-target')}
          label={`Cost target (${currency})`}
          error={errors.costTarget?.message}
          hint="Optional; e.g. the budget"
        >
          <TextInput
            id={id('cost-target')}
            inputMode="decimal"
            invalid={!!errors.costTarget}
            {...register('costTarget')}
          />
        </Field>
        <Field
          id={id('finish-target')}
          label="Finish target"
          error={errors.finishTarget?.message}
          hint={`Optional; on or after the base date ${baseDate}`}
        >
          <TextInput
            id={id('finish-target')}
            type="date"
            min={baseDate}
            invalid={!!errors.finishTarget}
            {...register('finishTarget')}
          />
        </Field>
      </div>
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
