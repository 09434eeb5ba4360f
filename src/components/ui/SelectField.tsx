import type { SelectHTMLAttributes } from 'react';
import { FieldFrame } from './FieldFrame';

interface Props extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled select whose hint and error are tied to it for screen readers. */
export function SelectField({ label, error, hint, id, children, ...props }: Props) {
  return (
    <FieldFrame label={label} error={error} hint={hint} id={id}>
      {(control) => (
        <select {...control} {...props}>
          {children}
        </select>
      )}
    </FieldFrame>
  );
}
