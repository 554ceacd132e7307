import { forwardRef, type InputHTMLAttributes, type SelectHTMLAttributes } from 'react';

const control =
  'w-full rounded border bg-paper-raised px-2.5 py-1.5 text-base text-ink placeholder:text-ink-faint focus:border-cost focus:outline-none';

type FieldProps = { label: string; error?: string; hint?: string; id: string; children: React.ReactNode };

/** A label, its control, and the reason when the value is not accepted. */
export function Field({ label, error, hint, id, children }: FieldProps) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-ink-soft">
        {label}
      </label>
      {children}
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-xs text-invalid">
          {error}
        </p>
      ) : hint ? (
        <p className="text-xs text-ink-faint">{hint}</p>
      ) : null}
    </div>
  );
}

type Invalid = { invalid?: boolean; className?: string };

/** The look and state every control shares: its border says whether the value is accepted. */
const controlProps = ({ invalid, className = '' }: Invalid) => ({
  'aria-invalid': invalid || undefined,
  className: `${control} ${invalid ? 'border-invalid' : 'border-rule-strong'} ${className}`,
});

type InputProps = InputHTMLAttributes<HTMLInputElement> & Invalid;
export const TextInput = forwardRef<HTMLInputElement, InputProps>(function TextInput(
  { invalid, className, ...props },
  ref,
) {
  return <input ref={ref} {...controlProps({ invalid, className })} {...props} />;
});

type SelectProps = SelectHTMLAttributes<HTMLSelectElement> & Invalid;
export const Select = forwardRef<HTMLSelectElement, SelectProps>(function Select(
  { invalid, className, ...props },
  ref,
) {
  return <select ref={ref} {...controlProps({ invalid, className })} {...props} />;
});
