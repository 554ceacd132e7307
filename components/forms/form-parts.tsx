'use client';
// What the account forms share: a table of text fields, the frame with the failure notice and
// the submit button, and how a refused request lands on the form.
import type {
  FieldErrors,
  FieldValues,
  Path,
  SubmitHandler,
  UseFormRegister,
  UseFormReturn,
  UseFormSetError,
} from 'react-hook-form';
import { Field, TextInput } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiError } from './api';

/** One text field, as a row of a form's table of fields; the id is the field's name. */
export type TextFieldSpec<V extends FieldValues> = {
  name: Path<V>;
  label: string;
  type?: 'email' | 'password';
  autoComplete: string;
  autoFocus?: boolean;
  hint?: string;
};

function TextFields<V extends FieldValues>({
  fields,
  register,
  errors,
}: {
  fields: TextFieldSpec<V>[];
  register: UseFormRegister<V>;
  errors: FieldErrors<V>;
}) {
  return fields.map(({ name, label, hint, ...input }) => {
    const error = (errors as Record<string, { message?: string } | undefined>)[name];
    return (
      <Field key={name} id={name} label={label} error={error?.message} hint={hint}>
        <TextInput id={name} {...input} invalid={!!error} {...register(name)} />
      </Field>
    );
  });
}

/** The button's words, and the words while the form is sent when they differ. */
export type SubmitWords = { idle: string; busy?: string };

/** The form: its failure above the fields, the fields, and one full-width submit button. */
export function AccountForm<V extends FieldValues>({
  form,
  fields,
  onSubmit,
  failure,
  submit,
  children,
}: {
  form: UseFormReturn<V>;
  fields: TextFieldSpec<V>[];
  onSubmit: SubmitHandler<V>;
  failure: string | null;
  submit: SubmitWords;
  /** Shown between the failure and the fields. */
  children?: React.ReactNode;
}) {
  const busy = form.formState.isSubmitting;
  return (
    <form onSubmit={form.handleSubmit(onSubmit)} className="space-y-4" noValidate>
      {failure ? <Notice tone="invalid">{failure}</Notice> : null}
      {children}
      <TextFields fields={fields} register={form.register} errors={form.formState.errors} />
      <Button type="submit" className="w-full" disabled={busy}>
        {busy && submit.busy ? submit.busy : submit.idle}
      </Button>
    </form>
  );
}

/**
 * Puts the server's field issues on the form's fields and its message above the form; with
 * `values`, only the issues of fields the form has.
 */
export function showRefusal<V extends FieldValues>(
  error: ApiError,
  setError: UseFormSetError<V>,
  setFailure: (message: string) => void,
  values?: V,
) {
  for (const issue of error.failure.issues) {
    if (!values || issue.path in values) setError(issue.path as Path<V>, { message: issue.message });
  }
  setFailure(error.failure.message);
}

/**
 * Sends the form with `send`: a refusal lands on the form's fields and above it; when the server
 * cannot be reached, `unreachable` says so.
 */
export async function sendForm<V extends FieldValues>(
  send: () => Promise<void>,
  setError: UseFormSetError<V>,
  setFailure: (message: string | null) => void,
  unreachable: string,
) {
  setFailure(null);
  try {
    await send();
  } catch (e) {
    if (e instanceof ApiError) showRefusal(e, setError, setFailure);
    else setFailure(unreachable);
  }
}
