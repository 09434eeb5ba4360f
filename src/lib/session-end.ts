/**
 * The session this tab was using has ended elsewhere: a 401 from the API (src/lib/api/client.ts) or a
 * socket refused at its handshake (src/features/table/api/socket.ts) says so. The layout listens, and tells the
 * person "You were signed out" on the page they were on (src/components/ui/Layout.tsx).
 */
import { create } from 'zustand';

type Listener = () => void;
const listeners = new Set<Listener>();

/** Calls `fn` whenever the server refuses this tab's session; returns the way to stop listening. */
export function onSessionEnded(fn: Listener): () => void {
  listeners.add(fn);
  return () => {
    listeners.delete(fn);
  };
}

export function sessionEnded(): void {
  for (const fn of [...listeners]) fn();
}

interface SignedOutNotice {
  /** The page (path and query) on which this tab found its session gone, or null. */
  at: string | null;
  mark: (at: string) => void;
  clear: () => void;
}

export const useSignedOutNotice = create<SignedOutNotice>()((set) => ({
  at: null,
  mark: (at) => set({ at }),
  clear: () => set({ at: null }),
}));
