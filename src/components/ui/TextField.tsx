import { useId, type InputHTMLAttributes } from 'react';

interface Props extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled input whose error is tied to it for screen readers. */
export function TextField({ label, error, hint, id, ...props }: Props) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const hintId = `${inputId}-hint`;
  const errorId = `${inputId}-error`;
  const describedBy = [hint ? hintId : '', error ? errorId : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={inputId} className="font-medium">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-base text-ink-soft">
          {hint}
        </p>
      )}
      <input
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`min-h-12 rounded-lg border-2 bg-card px-3 py-2 text-body ${error ? 'border-danger' : 'border-line'}`}
        {...props}
      />
      {error && (
        <p id={errorId} className="flex items-start gap-2 font-medium text-danger">
          <span aria-hidden="true">✕</span>
          {error}
        </p>
      )}
    </div>
  );
}
