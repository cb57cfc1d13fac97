import { Navigate, useLocation } from 'react-router-dom';
import { AppShell } from '@/components/layouts/app-shell';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { useMe } from '@/features/auth/api/me';

/** Every signed-in page sits under this route: no session means a trip to the sign-in page and back. */
export function ProtectedRoute() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <LoadingState label="Checking your session…" />;
  if (me.isError)
    return (
      <div className="mx-auto max-w-lg p-10">
        <ErrorState error={me.error} onRetry={() => me.refetch()} />
      </div>
    );
  if (!me.data) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  return <AppShell />;
}
