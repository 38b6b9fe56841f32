import type { ButtonHTMLAttributes } from 'react';
import { cn } from '../lib/cn';
import { Spinner } from './spinner';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';
type Size = 'sm' | 'md';

const variantClasses: Record<Variant, string> = {
  primary: 'bg-ember-500 text-night-950 hover:bg-ember-400 disabled:bg-ember-700 disabled:text-night-800',
  secondary: 'border border-night-600 bg-night-800 text-night-100 hover:border-night-500 hover:bg-night-700',
  ghost: 'text-night-200 hover:bg-night-800 hover:text-night-100',
  danger: 'border border-alarm-500/60 bg-alarm-500/10 text-alarm-300 hover:bg-alarm-500/20',
};
const sizeClasses: Record<Size, string> = { sm: 'h-8 px-3 text-sm', md: 'h-10 px-4 text-sm' };

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: Variant;
  size?: Size;
  /** Shows a spinner and disables the button while an action runs. */
  busy?: boolean;
}

export function Button({ variant = 'primary', size = 'md', busy = false, className, children, disabled, type, ...rest }: ButtonProps) {
  return (
    <button
      type={type ?? 'button'}
      className={cn(
        'inline-flex items-center justify-center gap-2 rounded-md font-medium transition-colors',
        'disabled:cursor-not-allowed disabled:opacity-60 focus-ring',
        variantClasses[variant],
        sizeClasses[size],
        className,
      )}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy ? <Spinner size="sm" label="" /> : null}
      {children}
    </button>
  );
}
