import { useState } from 'react';
import { Link } from 'react-router-dom';
import { ROLE_LABELS } from '@shared/auth/roles';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { PageHeader, Panel } from '@/components/ui/states';
import { useSignedIn } from '@/lib/signed-in';
import { useChangePassword } from '@/features/auth/api/sign-in';

export function AccountRoute() {
  const me = useSignedIn();
  const change = useChangePassword();
  const [current, setCurrent] = useState('');
  const [next, setNext] = useState('');
  const fieldError = (field: string) => change.error && 'details' in change.error ? (change.error as { details?: { field?: string; message: string }[] }).details?.find((d) => d.field === field)?.message : undefined;
  return (
    <>
      <PageHeader eyebrow="Account" title={me.name} subtitle={`${me.email} · ${me.roles.map((r) => ROLE_LABELS[r]).join(', ')}`} />
      <Panel title="Change password" className="max-w-md">
        <form
          className="grid gap-4"
          onSubmit={(e) => {
            e.preventDefault();
            change.mutate({ currentPassword: current, newPassword: next }, { onSuccess: () => { setCurrent(''); setNext(''); } });
          }}
        >
          <Field label="Current password" htmlFor="current-password" error={fieldError('currentPassword')}>
            <Input id="current-password" type="password" autoComplete="current-password" value={current} onChange={(e) => setCurrent(e.target.value)} />
          </Field>
          <Field label="New password" htmlFor="new-password" hint="At least 12 characters. Your other sessions are signed out." error={fieldError('newPassword')}>
            <Input id="new-password" type="password" autoComplete="new-password" value={next} onChange={(e) => setNext(e.target.value)} />
          </Field>
          {change.isError && <p role="alert" className="text-sm text-changes">{change.error.message}</p>}
          {change.isSuccess && <p role="status" className="text-sm text-approved">Password changed.</p>}
          <div>
            <Button type="submit" variant="primary" busy={change.isPending}>Change password</Button>
          </div>
        </form>
      </Panel>
      <Panel title="API tokens" className="mt-6 max-w-md">
        <p className="text-sm text-ink-soft">Read-only tokens let your scripts read the catalog and download exports as you.</p>
        <Link className="mt-2 inline-block text-sm font-semibold text-copper underline" to="/account/tokens">Manage API tokens</Link>
      </Panel>
    </>
  );
}
