import { useState } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { AppShell } from '@/components/layouts/app-shell';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { useMe } from '@/lib/auth';
import { useSignOut } from '@/features/auth/api/sign-in';
import { NoticeBell } from '@/features/notices/components/notice-bell';
import { SignedInProvider } from '@/lib/signed-in';

/** Every signed-in page sits under this route: no session means a trip to the sign-in page and back. */
export function ProtectedRoute() {
  const me = useMe();
  const signOut = useSignOut();
  const location = useLocation();
  const [signingOut, setSigningOut] = useState(false);
  if (me.isPending) return <LoadingState label="Checking your session…" />;
  if (me.isError)
    return (
      <div className="mx-auto max-w-lg p-10">
        <ErrorState error={me.error} onRetry={() => me.refetch()} />
      </div>
    );
  if (!me.data) {
    // After "Sign out" go to the plain sign-in page; a lapsed session comes back here after signing in again.
    if (signingOut) return <Navigate to="/sign-in" replace />;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  }
  return (
    <SignedInProvider me={me.data}>
      <AppShell
        me={me.data}
        signingOut={signOut.isPending}
        notices={<NoticeBell />}
        onSignOut={() => {
          setSigningOut(true);
          signOut.mutate();
        }}
      />
    </SignedInProvider>
  );
}
