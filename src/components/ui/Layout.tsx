import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useRef, useState } from 'react';
import { Link, NavLink, Outlet, useLocation, useMatches, useNavigate } from 'react-router-dom';
import { meQuery, useMe, useSignOut } from '../../lib/api/auth';
import { onSessionEnded, useSignedOutNotice } from '../../lib/session-end';
import { Button } from './Button';
import { Card } from './Card';
import { TEXT_SIZES, usePreferences, type TextSize } from '../../lib/preferences';
import { signInPath } from '../../lib/return-path';

const SIZE_LABELS: Record<TextSize, string> = { standard: 'A', large: 'A+', largest: 'A++' };

function TextSizePicker() {
  const textSize = usePreferences((s) => s.textSize);
  const setTextSize = usePreferences((s) => s.setTextSize);
  useEffect(() => {
    document.documentElement.style.setProperty('--rackside-root-size', TEXT_SIZES[textSize]);
  }, [textSize]);
  return (
    <div role="group" aria-label="Text size" className="flex gap-1">
      {(Object.keys(TEXT_SIZES) as TextSize[]).map((size) => (
        <button
          key={size}
          type="button"
          aria-pressed={textSize === size}
          aria-label={`Text size ${size}`}
          onClick={() => setTextSize(size)}
          className={`min-h-10 min-w-10 rounded-md border-2 px-2 font-semibold ${textSize === size ? 'border-accent bg-accent text-accent-ink' : 'border-line bg-card text-ink'}`}
        >
          {SIZE_LABELS[size]}
        </button>
      ))}
    </div>
  );
}

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-2 font-medium no-underline ${isActive ? 'bg-accent-soft text-ink underline' : 'text-ink hover:bg-accent-soft'}`;

/** Said in place of the page when the session this tab used has ended elsewhere. */
function SignedOut({ at }: { at: string }) {
  return (
    <Card className="mx-auto max-w-lg">
      <h1 className="mb-3 text-title font-semibold">You were signed out</h1>
      <p className="mb-4">Rackside no longer knows this tab as you: you signed out in another tab or window, or your session ran out. Nothing on this page was lost on the server.</p>
      <p>
        <Link to={signInPath(at)} className="font-semibold">
          Sign in again
        </Link>{' '}
        <span className="text-ink-soft">to come back to this page.</span>
      </p>
    </Card>
  );
}

/**
 * Hears that the session ended (a 401 from the API, a socket refused at its handshake) and, for a tab
 * that was signed in, puts "You were signed out" in place of the page it is on.
 */
function useSessionEndNotice(): string | null {
  const queryClient = useQueryClient();
  const location = useLocation();
  const here = `${location.pathname}${location.search}`;
  const hereRef = useRef(here);
  const endedAt = useSignedOutNotice((s) => s.at);
  useEffect(() => {
    hereRef.current = here;
  }, [here]);
  useEffect(
    () =>
      onSessionEnded(() => {
        // A visitor who was never signed in hears 401s too: that is no news to them.
        if (!queryClient.getQueryData(meQuery.queryKey)) return;
        useSignedOutNotice.getState().mark(hereRef.current);
      }),
    [queryClient],
  );
  // The page is already replaced by the notice when the cache forgets the user, so no page sees itself signed out first.
  useEffect(() => {
    if (endedAt === null) return;
    if (queryClient.getQueryData(meQuery.queryKey)) {
      queryClient.setQueryData(meQuery.queryKey, null);
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'me' });
    }
  }, [endedAt, queryClient]);
  // Going anywhere else (signing in, another page) ends the notice.
  useEffect(() => {
    if (endedAt !== null && endedAt !== here) useSignedOutNotice.getState().clear();
  }, [endedAt, here]);
  return endedAt !== null && endedAt === here ? endedAt : null;
}

export function Layout() {
  const { data: cachedMe } = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  const endedAt = useSessionEndNotice();
  const me = endedAt === null ? cachedMe : null;
  // The table and replay pages use the whole width of a laptop, so a rack fits on one line.
  const wide = useMatches().some((m) => (m.handle as { wide?: boolean } | undefined)?.wide);
  const width = wide ? 'max-w-[90rem]' : 'max-w-5xl';
  // On a phone the links fold behind a menu button; the menu stays open only on the page where it was opened.
  const { pathname } = location;
  const [openAt, setOpenAt] = useState<string | null>(null);
  const menuOpen = openAt === pathname;
  const menuButton = useRef<HTMLButtonElement>(null);
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-4 focus:top-4 focus:z-10 focus:bg-card focus:p-3">
        Skip to the page
      </a>
      <header className="border-b-2 border-ink/10 bg-card">
        <div className={`mx-auto flex ${width} flex-wrap items-center gap-x-3 gap-y-2 px-4 py-2 sm:gap-x-4 sm:py-3`}>
          <Link to="/" className="text-lg font-semibold text-ink no-underline sm:text-2xl">
            <span aria-hidden="true" className="mr-2 inline-block rounded-md bg-accent px-2 text-accent-ink">R</span>
            Rackside
          </Link>
          <button
            ref={menuButton}
            type="button"
            aria-expanded={menuOpen}
            aria-controls="site-menu"
            onClick={() => setOpenAt(menuOpen ? null : pathname)}
            className="ml-auto flex min-h-11 items-center gap-1.5 rounded-md border-2 border-ink-soft bg-card px-2.5 text-base font-semibold sm:hidden"
          >
            <span aria-hidden="true">{menuOpen ? '✕' : '☰'}</span>
            Menu
          </button>
          <div
            id="site-menu"
            onKeyDown={(e) => {
              if (e.key === 'Escape' && menuOpen) {
                setOpenAt(null);
                menuButton.current?.focus();
              }
            }}
            className={`${menuOpen ? 'flex' : 'hidden'} w-full flex-col gap-3 pb-2 sm:flex sm:w-auto sm:flex-1 sm:flex-row sm:flex-wrap sm:items-center sm:gap-4 sm:pb-0`}
          >
            <nav aria-label="Main" className="flex flex-col gap-1 sm:flex-row sm:flex-wrap">
              <NavLink to="/" end className={navClass}>
                Home
              </NavLink>
              {me && (
                <NavLink to="/history" className={navClass}>
                  My exchanges
                </NavLink>
              )}
              {me && (
                <NavLink to="/progress" end className={navClass}>
                  My progress
                </NavLink>
              )}
              {(me?.role === 'teacher' || me?.role === 'admin') && (
                <>
                  <NavLink to="/drills" className={navClass}>
                    Drills
                  </NavLink>
                  <NavLink to="/pattern-lists" className={navClass}>
                    Pattern lists
                  </NavLink>
                </>
              )}
              {me && (
                <NavLink to="/lessons" className={navClass}>
                  Lessons
                </NavLink>
              )}
              {(me?.role === 'teacher' || me?.role === 'admin') && (
                <NavLink to="/mail" className={navClass}>
                  Mail
                </NavLink>
              )}
              {me?.role === 'admin' && (
                <NavLink to="/admin/users" className={navClass}>
                  People
                </NavLink>
              )}
            </nav>
            <div className="flex flex-wrap items-center gap-3 sm:ml-auto">
              <TextSizePicker />
              {me ? (
                <Button
                  kind="plain"
                  onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in') })}
                  disabled={signOut.isPending}
                >
                  Sign out
                </Button>
              ) : (
                <Link to={signInPath(`${location.pathname}${location.search}`)} className="font-semibold">
                  Sign in
                </Link>
              )}
            </div>
          </div>
        </div>
      </header>
      <main id="main" className={`mx-auto w-full ${width} flex-1 px-4 py-8`}>
        {endedAt === null ? <Outlet /> : <SignedOut at={endedAt} />}
      </main>
    </div>
  );
}
