import type { ButtonHTMLAttributes } from 'react';
import { Link, type LinkProps } from 'react-router';
import { cn } from './cn';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';
export type ButtonSize = 'md' | 'sm';

const base =
  'inline-flex items-center justify-center gap-2 rounded-[3px] font-medium leading-none whitespace-nowrap ' +
  'transition-colors disabled:cursor-not-allowed disabled:opacity-55';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-ink text-paper-card hover:bg-ink-soft border border-ink',
  secondary: 'border border-rule-strong bg-paper-card/60 text-ink hover:bg-paper-deep hover:border-ink-faint',
  quiet: 'text-accent hover:text-ink underline-offset-4 hover:underline px-0',
  danger: 'border border-danger/45 text-danger bg-transparent hover:bg-danger-soft',
};

const sizes: Record<ButtonSize, string> = {
  md: 'h-10 px-4 text-[0.9375rem]',
  sm: 'h-8 px-3 text-sm',
};

export function buttonClasses(variant: ButtonVariant = 'primary', size: ButtonSize = 'md', extra?: string) {
  return cn(base, variants[variant], variant === 'quiet' ? (size === 'sm' ? 'h-8 text-sm' : 'h-10') : sizes[size], extra);
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** shows a busy label and disables the button while a request runs */
  busy?: boolean;
  busyLabel?: string;
}

export function Button({
  variant = 'primary',
  size = 'md',
  busy = false,
  busyLabel,
  className,
  children,
  disabled,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClasses(variant, size, className)}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      {...rest}
    >
      {busy && <span aria-hidden="true" className="busy-dot" />}
      {busy && busyLabel ? busyLabel : children}
    </button>
  );
}

export interface ButtonLinkProps extends LinkProps {
  variant?: ButtonVariant;
  size?: ButtonSize;
}

export function ButtonLink({ variant = 'secondary', size = 'md', className, ...rest }: ButtonLinkProps) {
  return <Link className={buttonClasses(variant, size, typeof className === 'string' ? className : undefined)} {...rest} />;
}
