import { useId, type SelectHTMLAttributes } from 'react';

interface Props extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled select whose hint and error are tied to it for screen readers, like TextField. */
export function SelectField({ label, error, hint, id, children, ...props }: Props) {
  const autoId = useId();
  const selectId = id ?? autoId;
  const describedBy = [hint ? `${selectId}-hint` : '', error ? `${selectId}-error` : ''].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={selectId} className="font-medium">
        {label}
      </label>
      {hint && (
        <p id={`${selectId}-hint`} className="text-base text-ink-soft">
          {hint}
        </p>
      )}
      <select
        id={selectId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`min-h-12 rounded-lg border-2 bg-card px-3 py-2 text-body ${error ? 'border-danger' : 'border-line'}`}
        {...props}
      >
        {children}
      </select>
      {error && (
        <p id={`${selectId}-error`} className="flex items-start gap-2 font-medium text-danger">
          <span aria-hidden="true">✕</span>
          {error}
        </p>
      )}
    </div>
  );
}
