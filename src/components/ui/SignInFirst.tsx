import { Navigate, useLocation } from 'react-router-dom';
import { signInPath } from '../../lib/return-path';

/** For a page that needs an account: off to sign in, and back to this very page afterwards. */
export function SignInFirst() {
  const { pathname, search } = useLocation();
  return <Navigate to={signInPath(`${pathname}${search}`)} replace />;
}
