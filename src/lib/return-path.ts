/** Where to go after signing in: a path on this site only, never another site or the sign-in page itself. */
const BASE = 'https://rackside.invalid';
const NO_RETURN = ['/sign-in', '/register', '/forgot-password', '/reset-password'];

export function safeReturnPath(raw: string | null | undefined, fallback = '/'): string {
  if (!raw || raw.length > 2000) return fallback;
  // One leading slash: "//host" and "/\host" name another site to a browser.
  if (!raw.startsWith('/') || raw.startsWith('//') || raw.includes('\\')) return fallback;
  for (let i = 0; i < raw.length; i++) {
    const code = raw.charCodeAt(i);
    if (code < 0x20 || code === 0x7f) return fallback;
  }
  let url: URL;
  try {
    url = new URL(raw, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE) return fallback;
  if (NO_RETURN.some((p) => url.pathname === p || url.pathname.startsWith(`${p}/`))) return fallback;
  return `${url.pathname}${url.search}${url.hash}`;
}

/** The sign-in page, told to come back to `here` (a path with its query) when that is worth coming back to. */
export function signInPath(here: string): string {
  const back = safeReturnPath(here, '');
  return back && back !== '/' ? `/sign-in?next=${encodeURIComponent(back)}` : '/sign-in';
}
