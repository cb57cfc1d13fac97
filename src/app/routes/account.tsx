import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { ROLE_LABELS } from '@shared/auth/roles';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import { changePasswordBody } from '@shared/schemas/people';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { PageHeader, Panel } from '@/components/ui/states';
import { invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { useSignedIn } from '@/lib/signed-in';
import { useChangePassword } from '@/features/auth/api/sign-in';

export function AccountRoute() {
  const me = useSignedIn();
  const change = useChangePassword();
  const form = useForm<z.input<typeof changePasswordBody>, unknown, z.output<typeof changePasswordBody>>({
    resolver: zodResolver(changePasswordBody),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  const errors = form.formState.errors;
  useServerFieldErrors(change.error, form.setError, sameNames(['currentPassword', 'newPassword']));
  return (
    <>
      <PageHeader eyebrow="Account" title={me.name} subtitle={`${me.email} · ${me.roles.map((r) => ROLE_LABELS[r]).join(', ')}`} />
      <Panel title="Change password" className="max-w-md">
        <form
          noValidate
          className="grid gap-4"
          onSubmit={form.handleSubmit((body) => change.mutate(body, { onSuccess: () => form.reset() }))}
        >
          <Field label={FIELD_LABELS.currentPassword} htmlFor="current-password" error={errors.currentPassword?.message}>
            <Input
              id="current-password"
              type="password"
              autoComplete="current-password"
              {...invalidProps('current-password', errors.currentPassword?.message)}
              {...form.register('currentPassword')}
            />
          </Field>
          <Field
            label={FIELD_LABELS.newPassword}
            htmlFor="new-password"
            hint="At least 12 characters. Your other sessions are signed out."
            error={errors.newPassword?.message}
          >
            <Input
              id="new-password"
              type="password"
              autoComplete="new-password"
              {...invalidProps('new-password', errors.newPassword?.message)}
              {...form.register('newPassword')}
            />
          </Field>
          {change.isError && (
            <p role="alert" className="text-sm text-changes">
              {change.error.message}
            </p>
          )}
          {change.isSuccess && (
            <p role="status" className="text-sm text-approved">
              Password changed.
            </p>
          )}
          <div>
            <Button type="submit" variant="primary" busy={change.isPending}>
              Change password
            </Button>
          </div>
        </form>
      </Panel>
      <Panel title="API tokens" className="mt-6 max-w-md">
        <p className="text-sm text-ink-soft">Read-only tokens let your scripts read the catalog and download exports as you.</p>
        <Link className="mt-2 inline-block text-sm font-semibold text-copper underline" to="/account/tokens">
          Manage API tokens
        </Link>
      </Panel>
    </>
  );
}
