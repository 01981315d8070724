import { useState, type ChangeEvent, type ReactNode } from 'react';
import { get, useController, useFormContext, useFormState, type Path } from 'react-hook-form';
import type { UnitSystem } from '@shared/schemas/enums';
import { Field, inputClass } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { useUnits } from '../../../lib/units';
import { heldListText, heldText, shownListText, shownText, unitOf, type Quantity } from '../../../lib/quantity-text';
import { messageAt, type FormValues } from '../lib/form-values';
import { numberKeyboard } from '../../../lib/number-text';
import { PlusIcon } from '../../../components/ui/icons';

// Inputs bound to the submission form by name; each shows its own error beside it.

type Name = Path<FormValues>;

/**
 * The field's problem, once the person has left the field or tried to send (never on a row just
 * added); the server's reasons show at once. Each field keeps a line for it, so nothing moves.
 */
function useFieldError(name: string) {
  const { errors, touchedFields, isSubmitted } = useFormState<FormValues>({ name: name as Name });
  const message = messageAt(errors, name);
  if (!message) return undefined;
  const fromServer = (get(errors, name) as { type?: string } | undefined)?.type === 'server';
  return isSubmitted || fromServer || get(touchedFields, name) ? message : undefined;
}

type Common = { name: Name; label: ReactNode; hint?: ReactNode; className?: string; disabled?: boolean };

export function FText({
  name,
  label,
  hint,
  className,
  disabled,
  placeholder,
  autoComplete = 'off',
}: Common & { placeholder?: string; autoComplete?: string }) {
  const { register } = useFormContext<FormValues>();
  const error = useFieldError(name);
  return (
    <Field label={label} hint={hint} error={error} className={className} reserveError>
      {(a11y) => (
        <input
          className={inputClass}
          {...a11y}
          {...register(name)}
          placeholder={placeholder}
          autoComplete={autoComplete}
          disabled={disabled}
        />
      )}
    </Field>
  );
}

/**
 * The input of a measured value: the form holds it in mm / N·m / bar, the person sees and types
 * it in the system the units toggle names. What is being typed stays as typed until the field
 * is left or the toggle is switched; then the text is derived again from the held value.
 */
function useMeasure(name: Name, quantity: Quantity, list = false) {
  const { system } = useUnits();
  const { field } = useController<FormValues>({ name });
  const [draft, setDraft] = useState<{ text: string; system: UnitSystem } | null>(null);
  const held = typeof field.value === 'string' ? field.value : '';
  const shown = list ? shownListText : shownText;
  const toHeld = list ? heldListText : heldText;
  return {
    unit: unitOf(quantity, system),
    input: {
      name: field.name,
      ref: field.ref,
      value: draft && draft.system === system ? draft.text : shown(held, quantity, system),
      onChange: (e: ChangeEvent<HTMLInputElement>) => {
        setDraft({ text: e.target.value, system });
        field.onChange(toHeld(e.target.value, quantity, system));
      },
      onBlur: () => {
        setDraft(null);
        field.onBlur();
      },
    },
  };
}

type NumProps = Common & {
  unit?: string;
  placeholder?: string;
  /** may be negative: phones then get a keyboard with a minus key (their decimal keypads have none) */
  signed?: boolean;
};

/** A number typed as text: decimal keypad on phones, comma or point, the unit beside it. */
export function FNum(props: NumProps & { quantity?: Quantity }) {
  return props.quantity ? <MeasureNum {...props} quantity={props.quantity} /> : <PlainNum {...props} />;
}

function PlainNum(props: NumProps) {
  const { register } = useFormContext<FormValues>();
  return <NumInput {...props} input={register(props.name)} />;
}

function MeasureNum(props: NumProps & { quantity: Quantity }) {
  const { unit, input } = useMeasure(props.name, props.quantity);
  return <NumInput {...props} unit={unit} input={input} />;
}

function NumInput({ name, label, hint, className, disabled, unit, placeholder, signed, input }: NumProps & { input: object }) {
  const error = useFieldError(name);
  return (
    <Field label={label} hint={hint} error={error} className={className} reserveError>
      {(a11y) => (
        <div className="flex items-stretch">
          <input
            className={`${inputClass} tabular ${unit ? 'rounded-r-none' : ''}`}
            {...numberKeyboard(signed)}
            autoComplete="off"
            {...a11y}
            // the unit is read out with the field, as its description
            aria-describedby={[unit ? `${a11y.id}-unit` : null, a11y['aria-describedby']].filter(Boolean).join(' ') || undefined}
            {...input}
            placeholder={placeholder}
            disabled={disabled}
          />
          {unit && (
            <span
              id={`${a11y.id}-unit`}
              className="flex min-w-10 items-center justify-center rounded-r-md border border-l-0 border-graphite/25 bg-paper-deep px-2 text-sm text-graphite-soft"
            >
              {unit}
            </span>
          )}
        </div>
      )}
    </Field>
  );
}

/** A comma-separated list of lengths (piston diameters), in the toggle's length unit. */
export function FLengthList({
  name,
  label,
  hint,
  className,
  disabled,
}: Omit<Common, 'hint'> & { hint: (unit: string) => ReactNode }) {
  const { unit, input } = useMeasure(name, 'length', true);
  const error = useFieldError(name);
  return (
    <Field label={label} hint={hint(unit)} error={error} className={className} reserveError>
      {(a11y) => <input className={inputClass} autoComplete="off" {...a11y} {...input} disabled={disabled} />}
    </Field>
  );
}

export function FArea({
  name,
  label,
  hint,
  className,
  disabled,
  rows = 3,
  placeholder,
}: Common & { rows?: number; placeholder?: string }) {
  const { register } = useFormContext<FormValues>();
  const error = useFieldError(name);
  return (
    <Field label={label} hint={hint} error={error} className={className} reserveError>
      {(a11y) => (
        <textarea
          className={inputClass}
          rows={rows}
          {...a11y}
          {...register(name)}
          placeholder={placeholder}
          disabled={disabled}
        />
      )}
    </Field>
  );
}

export function FSelect({
  name,
  label,
  hint,
  className,
  disabled,
  options,
}: Common & { options: readonly { value: string; label: string }[] }) {
  const { register } = useFormContext<FormValues>();
  const error = useFieldError(name);
  return (
    <Field label={label} hint={hint} error={error} className={className} reserveError>
      {(a11y) => (
        <select className={inputClass} {...a11y} {...register(name)} disabled={disabled}>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </Field>
  );
}

export function FCheck({ name, label, hint, className = '', disabled }: Common) {
  const { register } = useFormContext<FormValues>();
  return (
    <label className={`flex min-h-10 items-start gap-2 text-sm font-bold text-graphite ${className}`}>
      <input type="checkbox" className="mt-1 h-5 w-5 accent-ink" {...register(name)} disabled={disabled} />
      <span>
        {label}
        {hint && <span className="block text-xs font-normal text-graphite-soft">{hint}</span>}
      </span>
    </label>
  );
}

/** The error of a whole list (e.g. "List at least one part"), shown above its rows. */
export function ListError({ name }: { name: string }) {
  const { errors } = useFormState<FormValues>();
  const node = name
    .split('.')
    .reduce<unknown>((n, k) => (n && typeof n === 'object' ? (n as Record<string, unknown>)[k] : undefined), errors);
  const own =
    node && typeof node === 'object'
      ? ((node as { root?: { message?: string }; message?: string }).root?.message ?? (node as { message?: string }).message)
      : undefined;
  return own ? (
    <p role="alert" className="text-sm font-semibold text-oxide">
      {own}
    </p>
  ) : null;
}

/** One section of the form, with an anchor for the outline. */
export function FormSection({ id, title, lead, children }: { id: string; title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <section
      id={id}
      aria-labelledby={`${id}-h`}
      className="scroll-mt-20 rounded-xl border border-ink/10 bg-paper-card p-4 shadow-sm sm:p-6"
    >
      <h2 id={`${id}-h`} className="text-lg font-extrabold text-ink">
        {title}
      </h2>
      {lead && <p className="mt-1 text-sm text-graphite-soft">{lead}</p>}
      <div className="mt-4 space-y-4">{children}</div>
    </section>
  );
}

/** A row of a list with its position and a remove button. */
export function ListRow({
  label,
  onRemove,
  children,
  disabled,
}: {
  label: string;
  onRemove: () => void;
  children: ReactNode;
  disabled?: boolean;
}) {
  return (
    <fieldset className="rounded-lg border border-graphite/15 bg-paper p-3 sm:p-4">
      <legend className="px-1 text-sm font-bold text-ink">{label}</legend>
      <div className="grid gap-3 sm:grid-cols-2">{children}</div>
      <div className="mt-3 flex justify-end">
        <Button variant="quiet" onClick={onRemove} disabled={disabled} aria-label={`Remove ${label.toLowerCase()}`}>
          Remove
        </Button>
      </div>
    </fieldset>
  );
}

/** Fields most records leave empty, folded away so a short record stays quick to write. */
export function MoreFields({ summary, children }: { summary: string; children: ReactNode }) {
  return (
    <details className="group sm:col-span-2">
      <summary className="cursor-pointer text-sm font-bold text-ink underline-offset-2 hover:underline">{summary}</summary>
      <div className="mt-3 grid gap-3 sm:grid-cols-2">{children}</div>
    </details>
  );
}

export function AddButton({ onClick, children, disabled }: { onClick: () => void; children: ReactNode; disabled?: boolean }) {
  return (
    <Button variant="secondary" onClick={onClick} disabled={disabled}>
      <PlusIcon className="mr-1.5 h-4 w-4" /> {children}
    </Button>
  );
}
