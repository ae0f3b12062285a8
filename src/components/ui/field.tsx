import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from "react";

export const controlClasses =
  "block w-full min-h-11 rounded-md border border-rule-strong bg-card px-3 py-2 text-ink placeholder:text-ink-muted/80 hover:border-ink-muted aria-[invalid=true]:border-danger aria-[invalid=true]:bg-danger-soft/40 disabled:opacity-60";

const predicateStart = /^(must|needs?|is|are|has|have|contains?|should|cannot|can't|does|was|were)\b/;

/**
 * The shared schemas word problems to follow the field's label ("needs at least 2 characters"),
 * so those read as "Name needs at least 2 characters"; anything else is shown as a sentence.
 */
export function fieldErrorText(label: string, message: string): string {
  const text = message.trim();
  if (predicateStart.test(text)) return `${label} ${text}`;
  return text.charAt(0).toUpperCase() + text.slice(1);
}

type FieldProps = {
  label: string;
  /** Shown as the label; defaults to `label`. Use when the visible label needs markup. */
  labelContent?: ReactNode;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  className?: string;
  children: (ids: { id: string; describedBy: string | undefined; invalid: boolean }) => ReactNode;
};

/** A label, an optional hint, the control, and its error, wired together for screen readers. */
export function Field({ label, labelContent, hint, error, optional, className = "", children }: FieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={`flex flex-col gap-1.5 ${className}`}>
      <label htmlFor={id} className="font-bold text-ink">
        {labelContent ?? label}
        {optional && <span className="ml-1.5 font-normal text-ink-muted">(optional)</span>}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      )}
      {children({ id, describedBy, invalid: Boolean(error) })}
      {error && (
        <p id={errorId} className="flex items-start gap-1.5 text-sm font-bold text-danger">
          <span aria-hidden="true">!</span>
          <span>{fieldErrorText(label, error)}</span>
        </p>
      )}
    </div>
  );
}

export const TextInput = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement>>(function TextInput(
  { className = "", ...rest },
  ref,
) {
  return <input ref={ref} className={`${controlClasses} ${className}`} {...rest} />;
});

export const SelectInput = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement>>(function SelectInput(
  { className = "", children, ...rest },
  ref,
) {
  return (
    <select ref={ref} className={`${controlClasses} select-chevron pr-9 ${className}`} {...rest}>
      {children}
    </select>
  );
});

export const TextArea = forwardRef<HTMLTextAreaElement, TextareaHTMLAttributes<HTMLTextAreaElement>>(function TextArea(
  { className = "", ...rest },
  ref,
) {
  return <textarea ref={ref} className={`${controlClasses} min-h-28 ${className}`} {...rest} />;
});

type CheckboxProps = InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; hint?: ReactNode };

export const Checkbox = forwardRef<HTMLInputElement, CheckboxProps>(function Checkbox({ label, hint, id, ...rest }, ref) {
  const autoId = useId();
  const inputId = id ?? autoId;
  return (
    <div className="flex items-start gap-3">
      {/* The 44px hit area is the label row; the box itself stays a normal size. */}
      <input ref={ref} id={inputId} type="checkbox" className="mt-3 h-5 w-5 shrink-0 accent-accent" {...rest} />
      <label htmlFor={inputId} className="flex min-h-11 flex-col justify-center py-1">
        <span className="font-bold">{label}</span>
        {hint && <span className="text-sm text-ink-muted">{hint}</span>}
      </label>
    </div>
  );
});

type TextFieldProps = Omit<FieldProps, "children" | "className"> &
  Omit<InputHTMLAttributes<HTMLInputElement>, "className"> & {
    /** The wrapper's classes (label, hint, input and error together). */
    className?: string;
    inputClassName?: string;
  };

/** A Field holding one text input, wired to its label, hint and error (register() spreads onto it). */
export const TextField = forwardRef<HTMLInputElement, TextFieldProps>(function TextField(
  { label, labelContent, hint, error, optional, className, inputClassName, ...input },
  ref,
) {
  return (
    <Field label={label} labelContent={labelContent} hint={hint} error={error} optional={optional} className={className}>
      {(f) => (
        <TextInput ref={ref} id={f.id} aria-describedby={f.describedBy} aria-invalid={f.invalid || undefined} className={inputClassName} {...input} />
      )}
    </Field>
  );
});
