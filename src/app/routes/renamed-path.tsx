import { Navigate, useLocation } from 'react-router-dom';

/** An address from before the vocabulary rename (a bookmark, an older mail) sent on to its new name. */
export function RenamedPath({ from, to }: { from: string; to: string }) {
  const { pathname, search, hash } = useLocation();
  return <Navigate replace to={`${pathname.replace(`/${from}`, `/${to}`)}${search}${hash}`} />;
}
