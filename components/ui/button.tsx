import type { ButtonHTMLAttributes } from 'react';

const VARIANTS = {
  primary: 'bg-cost text-paper-raised hover:bg-cost-dark border-cost',
  secondary: 'bg-paper-raised text-ink hover:bg-paper-sunk border-rule-strong',
  danger: 'bg-paper-raised text-invalid hover:bg-invalid-light border-invalid',
  ghost: 'bg-transparent text-ink-soft hover:text-ink hover:bg-paper-sunk border-transparent',
};
type Variant = keyof typeof VARIANTS;

export function buttonClass(variant: Variant = 'primary', extra = '') {
  return `inline-flex items-center justify-center gap-1.5 rounded border px-3 py-1.5 text-sm font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-50 ${VARIANTS[variant]} ${extra}`;
}

export function Button({
  variant = 'primary',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return <button type={type} className={buttonClass(variant, className)} {...props} />;
}
