import { useState } from 'react';
import type { ClientEventName, ClientPayload } from '../../../../shared/protocol';
import { send } from './socket';

/** Sends table events for the page: busy while an ack is awaited, and a refusal in words to show. */
export function useTableActions() {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function run<E extends ClientEventName>(event: E, payload: ClientPayload<E>): Promise<boolean> {
    setBusy(true);
    setError(null);
    const ack = await send(event, payload);
    setBusy(false);
    if (!ack.ok) setError(ack.message);
    return ack.ok;
  }
  return { busy, error, run };
}

export type RunTableAction = ReturnType<typeof useTableActions>['run'];
