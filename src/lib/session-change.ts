/** Lets sign-in and sign-out tell an open socket to reconnect with the new session, without loading the socket code. */
let listener: (() => void) | null = null;

export function onSessionChange(fn: () => void) {
  listener = fn;
}

export function sessionChanged() {
  listener?.();
}
