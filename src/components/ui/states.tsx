import type { ReactNode } from 'react';
import { isApiError } from '@/lib/api-client';
import { Button, Spinner } from './button';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="flex min-h-32 items-center justify-center py-10">
      <Spinner label={label} />
    </div>
  );
}

export function ErrorState({
  error,
  onRetry,
  title = 'This could not be loaded',
}: {
  error: unknown;
  onRetry?: () => void;
  title?: string;
}) {
  const message = error instanceof Error ? error.message : String(error);
  const forbidden = isApiError(error, 403);
  const missing = isApiError(error, 404);
  // Only a failure that may pass on a second try offers one: never a refusal or something that does not exist.
  const retryable = !isApiError(error) || error.status === 0 || error.status >= 500;
  return (
    <div role="alert" className="rounded-lg border border-changes/30 bg-changes-soft/60 px-5 py-4">
      <p className="font-semibold text-changes">{forbidden ? 'Not allowed for your roles' : missing ? 'Not found' : title}</p>
      <p className="mt-1 text-sm text-ink-soft">{message}</p>
      {missing && (
        <p className="mt-2 text-sm">
          <a href="/" className="font-semibold text-copper underline underline-offset-4">
            Back to the workbench
          </a>
        </p>
      )}
      {onRetry && retryable && (
        <Button className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-rule bg-paper-raised/60 px-6 py-10 text-center">
      <p className="font-semibold">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-prose text-sm text-ink-soft">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}

export function PageHeader({
  title,
  subtitle,
  action,
  eyebrow,
}: {
  title: string;
  subtitle?: ReactNode;
  action?: ReactNode;
  eyebrow?: ReactNode;
}) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4">
      <div className="min-w-0">
        {eyebrow && <div className="mb-1 text-xs font-semibold uppercase tracking-wider text-ink-faint">{eyebrow}</div>}
        <h1 className="break-words text-2xl font-bold">{title}</h1>
        {subtitle && <div className="mt-1 text-ink-soft">{subtitle}</div>}
      </div>
      {action}
    </header>
  );
}

export function Panel({
  title,
  children,
  className = '',
  actions,
}: {
  title?: ReactNode;
  children: ReactNode;
  className?: string;
  actions?: ReactNode;
}) {
  return (
    <section
      className={`min-w-0 rounded-lg border border-rule bg-paper-raised p-4 sm:p-5 shadow-[0_1px_0_rgba(24,34,58,0.04)] ${className}`}
    >
      {(title || actions) && (
        <div className="mb-3 flex items-center justify-between gap-3">
          {title && <h2 className="text-lg font-semibold">{title}</h2>}
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}
