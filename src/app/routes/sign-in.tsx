import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { LogoMark } from '@/components/ui/logo-mark';
import { LoadingState } from '@/components/ui/states';
import { useMe } from '@/lib/auth';
import { SignInForm } from '@/features/auth/components/sign-in-form';

function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

export function SignInRoute() {
  const me = useMe();
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNext(params.get('next'));
  if (me.isPending) return <LoadingState />;
  if (me.data) return <Navigate to={next} replace />;
  return (
    <div className="flex min-h-screen items-center justify-center px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-3 text-ink">
          <LogoMark size={40} />
          <div>
            <div className="text-2xl font-bold tracking-tight">Epsigma</div>
            <div className="text-sm text-ink-soft">Lennard-Jones parameters, fitted and reviewed</div>
          </div>
        </div>
        <div className="rounded-lg border border-rule bg-paper-raised p-6 shadow-sm">
          <h1 className="mb-4 text-lg font-semibold">Sign in</h1>
          <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
        </div>
      </div>
    </div>
  );
}
