import type { ReactNode } from 'react';
import { hasPolicy, type Policy } from '@shared/auth/roles';
import { useMe } from '@/lib/auth';

/** True when the signed-in user's roles grant the policy (the server checks again; this only hides). */
export function useCan(policy: Policy): boolean {
  const me = useMe().data;
  return !!me && hasPolicy(me.roles, policy);
}

export function Authorization({ policy, children, fallback = null }: { policy: Policy; children: ReactNode; fallback?: ReactNode }) {
  return <>{useCan(policy) ? children : fallback}</>;
}
