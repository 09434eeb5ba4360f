import type { InputHTMLAttributes } from 'react';
import { FieldFrame } from './FieldFrame';

interface Props extends InputHTMLAttributes<HTMLInputElement> {
  label: string;
  error?: string;
  hint?: string;
}

/** A labelled input whose hint and error are tied to it for screen readers. */
export function TextField({ label, error, hint, id, ...props }: Props) {
  return (
    <FieldFrame label={label} error={error} hint={hint} id={id}>
      {(control) => <input {...control} {...props} />}
    </FieldFrame>
  );
}
