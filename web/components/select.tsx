import type { Ref, SelectHTMLAttributes } from 'react';
import { cn } from '../lib/cn';
import { controlClasses } from './input';

export function Select({ className, ref, children, ...rest }: SelectHTMLAttributes<HTMLSelectElement> & { ref?: Ref<HTMLSelectElement> }) {
  return (
    <select ref={ref} className={cn(controlClasses, 'pr-8', className)} {...rest}>
      {children}
    </select>
  );
}
