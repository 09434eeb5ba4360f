import { useId, useRef, useState, type FormEvent, type ReactNode } from 'react';
import { ApiError } from '../../../lib/api/client';
import { Button } from '../../../components/ui/Button';

interface Props {
  label: string;
  hint: string;
  accept: string;
  /** Sends the file; resolves with what to show the person (a line, a link), or throws an ApiError. */
  onImport: (file: File) => Promise<ReactNode>;
}

/**
 * A file picker that sends one file and lists every problem the server found in it, line by line:
 * one problem as the message itself, several as a count over a list, each problem once. What a
 * success shows (and any link in it) goes away when the next import starts.
 */
export function FileImport({ label, hint, accept, onImport }: Props) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const [busy, setBusy] = useState(false);
  const [done, setDone] = useState<ReactNode>(null);
  const [error, setError] = useState('');
  const [problems, setProblems] = useState<[string, string][]>([]);

  const onSubmit = async (e: FormEvent) => {
    e.preventDefault();
    const file = input.current?.files?.[0];
    setDone(null);
    setProblems([]);
    if (!file) return setError('Choose a file first.');
    setError('');
    setBusy(true);
    try {
      setDone(await onImport(file));
      if (input.current) input.current.value = '';
    } catch (err) {
      if (err instanceof ApiError && err.code === 'BAD_FILE') {
        // `file` repeats the first problem, which the list holds already.
        const found = Object.entries(err.fields).filter(([k]) => k !== 'file');
        setError(found.length > 1 ? `The file has ${found.length} problems:` : (err.fields.file ?? err.message));
        setProblems(found.length > 1 ? found : []);
      } else if (err instanceof ApiError) setError(err.message);
      else setError('The file could not be sent. Please try again.');
    } finally {
      setBusy(false);
    }
  };

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <p id={`${id}-hint`} className="text-base text-ink-soft">
        {hint}
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <input
          ref={input}
          id={id}
          type="file"
          accept={accept}
          aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
          aria-invalid={error ? true : undefined}
          className="min-h-12 max-w-full rounded-lg border-2 border-line bg-card p-2 file:mr-3 file:min-h-8 file:rounded-md file:border-0 file:bg-accent-soft file:px-3 file:font-semibold"
        />
        <Button type="submit" disabled={busy}>
          {busy ? 'Importing…' : 'Import'}
        </Button>
      </div>
      {error && (
        <div id={`${id}-error`} role="alert" className="rounded-lg border-2 border-danger bg-danger-soft px-4 py-3 text-danger">
          <p className="font-medium">
            <span aria-hidden="true">✕ </span>
            {error}
          </p>
          {problems.length > 0 && (
            <ul className="mt-2 list-disc pl-6">
              {problems.map(([where, message]) => (
                <li key={where}>
                  <span className="font-semibold">{where}:</span> {message}
                </li>
              ))}
            </ul>
          )}
          <p className="mt-1 text-base">Nothing was saved. Fix the file and import it again.</p>
        </div>
      )}
      {done && (
        <div role="status" className="flex flex-col items-start gap-2 rounded-lg border-2 border-accent bg-accent-soft px-4 py-3 font-medium">
          {done}
        </div>
      )}
    </form>
  );
}
