'use client';

import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useRouter } from 'next/navigation';
import { z } from 'zod';
import { projectSchema, STAGES } from '@/lib/validation/project';
import { Field, Select, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError, callApi } from '@/components/forms/api';
import type { ProjectView } from '@/lib/view-types/projects';
import { readModelHeader } from '@/lib/registers/model-header';

type Values = z.input<typeof projectSchema>;

/** Creates a project, or edits one when `project` is given; `file` (optional) is imported right after creation. */
export function NewProjectForm({
  onDone,
  project,
  withFile = false,
}: {
  onDone?: () => void;
  project?: ProjectView;
  withFile?: boolean;
}) {
  const [file, setFile] = useState<File | null>(null);
  const [fromFile, setFromFile] = useState<string | null>(null);
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, setValue, getValues } = useForm<Values>({
    resolver: zodResolver(projectSchema),
    defaultValues: project
      ? {
          name: project.name,
          code: project.code,
          currency: project.currency,
          estimateClass: project.estimateClass,
          stage: project.stage as Values['stage'],
          baseDate: project.baseDate,
          description: project.description ?? '',
          costTarget: project.costTarget === null ? '' : String(project.costTarget),
          finishTarget: project.finishTarget ?? '',
        }
      : {
          currency: 'EUR',
          estimateClass: 4,
          stage: 'Concept',
          baseDate: new Date().toISOString().slice(0, 10),
        },
  });
  const e = formState.errors;

  /**
   * A model file names its project, currency, stage, estimate class and base date: the form takes
   * them (a typed name is kept).
   */
  async function chooseFile(chosen: File | null) {
    setFile(chosen);
    setFromFile(null);
    if (!chosen || !chosen.name.toLowerCase().endsWith('.json')) return;
    const model = readModelHeader(await chosen.text());
    if (!model) {
      setFromFile(
        'This file is not a model file (JSON with "format": "outturn-model"); the import will say why.',
      );
      return;
    }
    const taken: string[] = [];
    if (model.name && !getValues('name')) {
      setValue('name', model.name, { shouldValidate: true });
      taken.push('name');
    }
    if (model.currency) {
      setValue('currency', model.currency, { shouldValidate: true });
      taken.push('currency');
    }
    if (model.stage) {
      setValue('stage', model.stage, { shouldValidate: true });
      taken.push('stage');
    }
    if (model.estimateClass) {
      setValue('estimateClass', model.estimateClass as Values['estimateClass'], { shouldValidate: true });
      taken.push('estimate class');
    }
    if (model.baseDate) {
      setValue('baseDate', model.baseDate, { shouldValidate: true });
      taken.push('base date');
    }
    const missing = ['stage', 'estimate class', 'base date'].filter((f) => !taken.includes(f));
    setFromFile(
      [
        taken.length ? `Taken from the model file: ${listText(taken)}.` : '',
        missing.length
          ? `The file gives no ${listText(missing, 'or')}: check ${missing.length > 1 ? 'them' : 'it'} here.`
          : '',
      ]
        .filter(Boolean)
        .join(' '),
    );
  }

  async function onSubmit(values: Values) {
    setFailure(null);
    try {
      if (project) {
        await callApi(`/api/projects/${project.id}`, {
          method: 'PUT',
          body: { ...values, version: project.version },
        });
        onDone?.();
        router.refresh();
        return;
      }
      const created = (await callApi<{ project: ProjectView }>('/api/projects', { body: values })).project;
      if (file) {
        const form = new FormData();
        form.set('file', file);
        form.set('register', 'all');
        form.set('mode', 'commit');
        const res = await fetch(`/api/projects/${created.id}/import`, { method: 'POST', body: form });
        if (!res.ok) {
          const body = await res.json().catch(() => null);
          setFailure(
            `The project was created, but the file was not imported: ${body?.error?.message ?? res.status}. Open the project to import it again.`,
          );
          router.refresh();
          return;
        }
      }
      onDone?.();
      // Straight to the first tab: through /projects/:id the server's redirect costs a round trip
      // with nothing to show, and a refresh of the list here would race the navigation.
      router.push(`/projects/${created.id}/items`);
    } catch (err) {
      if (!(err instanceof ApiError)) throw err;
      for (const issue of err.failure.issues)
        setError(issue.path as keyof Values, { message: issue.message });
      setFailure(err.failure.message);
    }
  }

  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      className="grid grid-cols-2 gap-3"
      noValidate
      aria-label={project ? `Edit ${project.code}` : 'New project'}
    >
      {failure ? (
        <div className="col-span-2">
          <Notice tone="invalid">{failure}</Notice>
        </div>
      ) : null}
      <Field id="p-name" label="Name" error={e.name?.message}>
        <TextInput id="p-name" invalid={!!e.name} {...register('name')} />
      </Field>
      <Field id="p-code" label="Code" error={e.code?.message} hint="Short and unique, e.g. RIV-02">
        <TextInput id="p-code" invalid={!!e.code} {...register('code')} />
      </Field>
      <Field id="p-currency" label="Currency" error={e.currency?.message}>
        <TextInput id="p-currency" maxLength={3} invalid={!!e.currency} {...register('currency')} />
      </Field>
      <Field id="p-class" label="Estimate class (1–5)" error={e.estimateClass?.message}>
        <Select id="p-class" invalid={!!e.estimateClass} {...register('estimateClass')}>
          {[5, 4, 3, 2, 1].map((c) => (
            <option key={c} value={c}>
              Class {c}
            </option>
          ))}
        </Select>
      </Field>
      <Field id="p-stage" label="Stage" error={e.stage?.message}>
        <Select id="p-stage" invalid={!!e.stage} {...register('stage')}>
          {STAGES.map((s) => (
            <option key={s}>{s}</option>
          ))}
        </Select>
      </Field>
      <Field id="p-date" label="Base date" error={e.baseDate?.message}>
        <TextInput id="p-date" type="date" invalid={!!e.baseDate} {...register('baseDate')} />
      </Field>
      <div className="col-span-2">
        <Field id="p-desc" label="Description" error={e.description?.message}>
          <TextInput id="p-desc" {...register('description')} />
        </Field>
      </div>
      <Field
        id="p-cost-target"
        label={project ? `Cost target (${project.currency})` : 'Cost target'}
        error={e.costTarget?.message}
        hint="Optional; e.g. the budget. Each new run starts with it."
      >
        <TextInput
          id="p-cost-target"
          inputMode="decimal"
          invalid={!!e.costTarget}
          {...register('costTarget')}
        />
      </Field>
      <Field
        id="p-finish-target"
        label="Finish target"
        error={e.finishTarget?.message}
        hint="Optional; e.g. the handover date. Each new run starts with it."
      >
        <TextInput
          id="p-finish-target"
          type="date"
          invalid={!!e.finishTarget}
          {...register('finishTarget')}
        />
      </Field>
      {withFile ? (
        <div className="col-span-2 space-y-1">
          <label htmlFor="p-file" className="block text-sm font-medium text-ink-soft">
            Model file (.json) or workbook (.xlsx with sheets Line items, Risk events, Schedule, Correlations)
          </label>
          <input
            id="p-file"
            type="file"
            accept=".json,.xlsx"
            onChange={(ev) => void chooseFile(ev.target.files?.[0] ?? null)}
            className="block text-sm"
          />
          {fromFile ? (
            <p className="text-xs text-ink-soft" role="status">
              {fromFile}
            </p>
          ) : null}
        </div>
      ) : null}
      <div className="col-span-2">
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting
            ? 'Saving…'
            : project
              ? 'Save project'
              : file
                ? 'Create and import'
                : 'Create project'}
        </Button>
      </div>
    </form>
  );
}

/** "a, b and c" */
function listText(parts: string[], last = 'and'): string {
  return parts.length < 2 ? parts.join('') : `${parts.slice(0, -1).join(', ')} ${last} ${parts.at(-1)}`;
}
