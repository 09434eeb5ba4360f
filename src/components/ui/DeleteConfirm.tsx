import { useState } from 'react';
import { Button } from './Button';
import { FormMessage } from './FormMessage';

/** A delete button that asks once more before it acts. */
export function DeleteConfirm({ label, question, onConfirm, pending, error }: { label: string; question: string; onConfirm: () => void; pending: boolean; error?: Error | null }) {
  const [confirming, setConfirming] = useState(false);
  return (
    <div className="flex flex-wrap items-center gap-3 border-t border-line/40 pt-4">
      {confirming ? (
        <>
          <span>{question}</span>
          <Button onClick={onConfirm} disabled={pending}>
            Yes, delete it
          </Button>
          <Button kind="quiet" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </>
      ) : (
        <Button kind="quiet" onClick={() => setConfirming(true)}>
          {label}
        </Button>
      )}
      {error && <FormMessage error>{error.message}</FormMessage>}
    </div>
  );
}
