import type { InputHTMLAttributes, Ref } from 'react';
import { cn } from '../lib/cn';

export const controlClasses =
  'h-10 w-full rounded-md border border-night-600 bg-night-900 px-3 text-sm text-night-100 placeholder:text-night-400 ' +
  'focus-ring aria-[invalid=true]:border-alarm-400 disabled:opacity-60';

export function Input({ className, ref, ...rest }: InputHTMLAttributes<HTMLInputElement> & { ref?: Ref<HTMLInputElement> }) {
  return <input ref={ref} className={cn(controlClasses, className)} {...rest} />;
}
