import { useId, type ReactNode } from 'react';

/** What a form control in a FieldFrame is given: its id, what describes it, and its look. */
export interface ControlProps {
  id: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
  className: string;
}

interface Props {
  label: string;
  error?: string;
  hint?: string;
  id?: string;
  /** Draws the control with the props that tie it to its label, hint and error. */
  children: (control: ControlProps) => ReactNode;
}

/** A label, an optional hint and error, and the control they describe, tied together for screen readers. */
export function FieldFrame({ label, error, hint, id, children }: Props) {
  const autoId = useId();
  const controlId = id ?? autoId;
  const hintId = `${controlId}-hint`;
  const errorId = `${controlId}-error`;
  const describedBy = [hint ? hintId : '', error ? errorId : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={controlId} className="font-medium">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-base text-ink-soft">
          {hint}
        </p>
      )}
      {children({
        id: controlId,
        'aria-invalid': error ? true : undefined,
        'aria-describedby': describedBy,
        className: `min-h-12 rounded-lg border-2 bg-card px-3 py-2 text-body ${error ? 'border-danger' : 'border-line'}`,
      })}
      {error && (
        <p id={errorId} className="flex items-start gap-2 font-medium text-danger">
          <span aria-hidden="true">✕</span>
          {error}
        </p>
      )}
    </div>
  );
}
