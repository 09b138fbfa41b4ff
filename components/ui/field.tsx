import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

const controlClasses =
  'block w-full min-h-touch rounded-md border bg-white px-3 text-base text-ink placeholder:text-ink-faint aria-[invalid=true]:border-attention';

type FieldProps = { label: string; error?: string | undefined; hint?: ReactNode };

type ControlProps = { id: string; 'aria-invalid': true | undefined; 'aria-describedby': string | undefined };

/** Label, control, hint and error of one field: the control gets the ids that tie them together. */
function FieldFrame({ label, error, hint, className, control }: FieldProps & { className: string; control: (props: ControlProps) => ReactNode }) {
  const id = useId();
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-sm font-bold">
        {label}
      </label>
      {control({ id, 'aria-invalid': error ? true : undefined, 'aria-describedby': error ? `${id}-error` : hint ? `${id}-hint` : undefined })}
      {hint && !error ? (
        <p id={`${id}-hint`} className="mt-1 text-sm text-ink-faint">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${id}-error`} error={error} />
    </div>
  );
}

/** `className` styles the field's box (label, input, hint); `inputClassName` the input alone (a monospaced timecode). */
export function TextField({ label, error, hint, className = '', inputClassName = '', ...props }: FieldProps & { inputClassName?: string } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <FieldFrame label={label} error={error} hint={hint} className={className} control={(ids) => <input {...ids} className={`${controlClasses} border-ink/30 ${inputClassName}`} {...props} />} />
  );
}

/** A text field for lists people type one per line. */
export function TextAreaField({ label, error, hint, className = '', ...props }: FieldProps & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  return <FieldFrame label={label} error={error} hint={hint} className={className} control={(ids) => <textarea {...ids} className={`${controlClasses} border-ink/30 py-2`} {...props} />} />;
}

export function SelectField({
  label,
  error,
  children,
  className = '',
  ...props
}: FieldProps & SelectHTMLAttributes<HTMLSelectElement> & { children: ReactNode }) {
  // No hint on a select: FieldFrame then points aria-describedby at the error alone, as before.
  return (
    <FieldFrame
      label={label}
      error={error}
      className={className}
      control={(ids) => (
        <select {...ids} className={`${controlClasses} border-ink/30`} {...props}>
          {children}
        </select>
      )}
    />
  );
}

function FieldError({ id, error }: { id: string; error?: string | undefined }) {
  if (!error) return null;
  return (
    <p id={id} className="mt-1 text-sm font-bold text-attention-ink">
      {error}
    </p>
  );
}
