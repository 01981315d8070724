import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

export const inputClass =
  'w-full rounded-md border border-graphite/25 bg-paper-card px-3 py-2 text-base text-graphite shadow-inner placeholder:text-graphite-soft/70 focus:border-ink aria-[invalid=true]:border-oxide';

type FieldProps = {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  children: (props: { id: string; 'aria-invalid': boolean; 'aria-describedby'?: string }) => ReactNode;
  className?: string;
  /** keep a line for the error even while there is none, so an error coming or going moves nothing below it */
  reserveError?: boolean;
};

/** A label, the control, a hint and the field's error, wired together for screen readers. */
export function Field({ label, hint, error, children, className = '', reserveError = false }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-bold text-graphite">
        {label}
      </label>
      {children({ id, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
      {hint && (
        <p id={hintId} className="text-xs text-graphite-soft">
          {hint}
        </p>
      )}
      {error ? (
        <p id={errorId} role="alert" className="min-h-5 text-sm font-semibold text-oxide">
          {error}
        </p>
      ) : (
        reserveError && <p aria-hidden className="min-h-5" data-error-slot />
      )}
    </div>
  );
}

type Labelled = { label: ReactNode; hint?: ReactNode; error?: string; reserveError?: boolean };

export function TextInput({
  label,
  hint,
  error,
  className,
  reserveError,
  ...props
}: InputHTMLAttributes<HTMLInputElement> & Labelled) {
  return (
    <Field label={label} hint={hint} error={error} className={className} reserveError={reserveError}>
      {(a11y) => <input className={inputClass} {...a11y} {...props} />}
    </Field>
  );
}

export function TextArea({
  label,
  hint,
  error,
  className,
  reserveError,
  ...props
}: TextareaHTMLAttributes<HTMLTextAreaElement> & Labelled) {
  return (
    <Field label={label} hint={hint} error={error} className={className} reserveError={reserveError}>
      {(a11y) => <textarea className={inputClass} {...a11y} {...props} />}
    </Field>
  );
}

export function Select({
  label,
  hint,
  error,
  className,
  children,
  ...props
}: SelectHTMLAttributes<HTMLSelectElement> & { label: ReactNode; hint?: ReactNode; error?: string }) {
  return (
    <Field label={label} hint={hint} error={error} className={className}>
      {(a11y) => (
        <select className={inputClass} {...a11y} {...props}>
          {children}
        </select>
      )}
    </Field>
  );
}
