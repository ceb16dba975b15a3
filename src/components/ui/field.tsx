/**
 * Labelled form fields. The label is tied to its control (htmlFor/id); a hint and the error
 * message are tied with aria-describedby; the control is aria-invalid while it has an error.
 */
import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';
import { asSentence } from '../../lib/form';
import { cn } from './cn';

interface FieldShellProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  /** text shown right of the label, e.g. "optional" */
  aside?: ReactNode;
  className?: string;
  children: ReactNode;
}

function FieldShell({ id, label, hint, error, aside, className, children }: FieldShellProps) {
  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <div className="flex items-baseline justify-between gap-3">
        <label htmlFor={id} className="text-sm font-medium text-ink">
          {label}
        </label>
        {aside && <span className="text-xs text-ink-faint">{aside}</span>}
      </div>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs leading-relaxed text-ink-faint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="flex items-start gap-1.5 text-xs leading-relaxed text-danger">
          <span aria-hidden="true" className="mt-[0.3rem] inline-block h-1.5 w-1.5 shrink-0 rounded-full bg-danger" />
          <span>{asSentence(error)}</span>
        </p>
      )}
    </div>
  );
}

const controlBase =
  'w-full rounded-[3px] border bg-paper-card px-3 text-[0.9375rem] text-ink placeholder:text-ink-faint/80 ' +
  'transition-colors hover:border-ink-faint focus:border-accent disabled:opacity-60';

function controlClasses(error: string | undefined, extra?: string) {
  return cn(controlBase, error ? 'border-danger' : 'border-rule-strong', extra);
}

function describedBy(id: string, hint: ReactNode, error: string | undefined) {
  if (error) return `${id}-error`;
  if (hint) return `${id}-hint`;
  return undefined;
}

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  aside?: ReactNode;
  /** a unit shown inside the right edge of the input (JetBrains Mono) */
  unit?: string;
  fieldClassName?: string;
}

export function TextField({ label, hint, error, aside, unit, fieldClassName, className, ...input }: TextFieldProps) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} aside={aside} className={fieldClassName}>
      <div className="relative">
        <input
          id={id}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(id, hint, error)}
          className={controlClasses(error, cn('h-10', unit && 'pr-14', className))}
          {...input}
        />
        {unit && (
          <span
            aria-hidden="true"
            className="pointer-events-none absolute inset-y-0 right-3 flex items-center font-mono text-sm text-ink-faint"
          >
            {unit}
          </span>
        )}
      </div>
    </FieldShell>
  );
}

export interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  aside?: ReactNode;
  fieldClassName?: string;
}

export function TextAreaField({ label, hint, error, aside, fieldClassName, className, ...rest }: TextAreaFieldProps) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} aside={aside} className={fieldClassName}>
      <textarea
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={controlClasses(error, cn('min-h-[5.5rem] py-2 leading-relaxed', className))}
        {...rest}
      />
    </FieldShell>
  );
}

export interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  aside?: ReactNode;
  options: ReadonlyArray<{ value: string; label: string }>;
  fieldClassName?: string;
}

export function SelectField({ label, hint, error, aside, options, fieldClassName, className, ...rest }: SelectFieldProps) {
  const id = useId();
  return (
    <FieldShell id={id} label={label} hint={hint} error={error} aside={aside} className={fieldClassName}>
      <select
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(id, hint, error)}
        className={controlClasses(error, cn('h-10 select-chevron pr-9', className))}
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}
