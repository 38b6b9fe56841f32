import { Link, type LinkProps } from 'react-router-dom';
import { cn } from '../lib/cn';

export function TextLink({ className, ...rest }: LinkProps) {
  return <Link className={cn('rounded-sm text-ember-300 underline-offset-4 hover:underline focus-ring', className)} {...rest} />;
}
