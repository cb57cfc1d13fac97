import { createContext, useContext, type ReactNode } from 'react';
import type { Me } from '@shared/schemas/people';

const SignedInContext = createContext<Me | null>(null);

/** Holds the signed-in user for every page under the session check (set by the protected route). */
export function SignedInProvider({ me, children }: { me: Me; children: ReactNode }) {
  return <SignedInContext.Provider value={me}>{children}</SignedInContext.Provider>;
}

/**
 * The signed-in user. Pages under the protected route always have one: the route keeps the last known user
 * while a sign-out unmounts the pages, so no page ever reads a user that is gone.
 */
export function useSignedIn(): Me {
  const me = useContext(SignedInContext);
  if (!me) throw new Error('useSignedIn is used outside the signed-in pages');
  return me;
}
