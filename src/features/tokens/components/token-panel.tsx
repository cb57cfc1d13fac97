import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { formatDateTime } from '@shared/format/dates';
import { createTokenBody } from '@shared/schemas/tokens';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { useCreateToken, useMyTokens, useRevokeToken, type ApiToken } from '../api/tokens';

const when = (iso: string | null) => (iso ? formatDateTime(iso) : '—');

/** The new secret, shown once with a copy button; gone when dismissed. */
function NewSecret({ name, secret, onDone }: { name: string; secret: string; onDone: () => void }) {
  const [copied, setCopied] = useState(false);
  return (
    <div role="status" className="rounded-lg border border-approved/40 bg-approved-soft/60 px-4 py-3">
      <p className="font-semibold text-approved">Token “{name}” created</p>
      <p className="mt-1 text-sm">Copy it now: it is shown only this once. Epsigma keeps only a hash and cannot show it again.</p>
      <div className="mt-2 flex flex-wrap items-center gap-2">
        <code className="select-all break-all rounded bg-paper px-2 py-1 font-mono text-sm" data-testid="new-token">
          {secret}
        </code>
        <Button
          onClick={() => {
            void navigator.clipboard?.writeText(secret).then(
              () => setCopied(true),
              () => setCopied(false),
            );
          }}
        >
          {copied ? 'Copied' : 'Copy'}
        </Button>
        <Button variant="quiet" onClick={onDone}>
          Done
        </Button>
      </div>
      <pre className="mt-3 overflow-x-auto rounded bg-paper px-3 py-2 text-xs">{`export EPSIGMA_TOKEN=…   # the token above\ncurl -H "Authorization: Bearer $EPSIGMA_TOKEN" ${window.location.origin}/api/catalog`}</pre>
    </div>
  );
}

function TokenRow({ token }: { token: ApiToken }) {
  const revoke = useRevokeToken();
  return (
    <tr className="border-b border-rule/60">
      <td className="py-1.5 font-semibold">{token.name}</td>
      <td className="font-mono text-xs">{token.prefix}…</td>
      <td>{when(token.createdAt)}</td>
      <td>{when(token.lastUsedAt)}</td>
      <td>
        {token.active ? (
          <span className="text-approved">Active</span>
        ) : (
          <span className="text-ink-faint">Revoked {when(token.revokedAt)}</span>
        )}
      </td>
      <td className="text-right">
        {token.active && (
          <Button variant="danger" busy={revoke.isPending} onClick={() => revoke.mutate(token.id)} aria-label={`Revoke ${token.name}`}>
            Revoke
          </Button>
        )}
      </td>
    </tr>
  );
}

/** Create, list and revoke personal read-only API tokens for the catalog and export routes. */
export function TokenPanel() {
  const tokens = useMyTokens();
  const create = useCreateToken();
  const [shown, setShown] = useState<{ name: string; secret: string } | null>(null);
  const form = useForm<z.input<typeof createTokenBody>, unknown, z.output<typeof createTokenBody>>({
    resolver: zodResolver(createTokenBody),
    defaultValues: { name: '' },
  });
  useServerFieldErrors(create.error, form.setError, sameNames(['name']));
  const nameError = form.formState.errors.name?.message;
  return (
    <div className="grid gap-5">
      <form
        noValidate
        className="flex flex-wrap items-end gap-3"
        onSubmit={form.handleSubmit((body) =>
          create.mutate(body, {
            onSuccess: (t) => {
              setShown({ name: t.name, secret: t.token });
              form.reset();
              create.reset(); // the secret stays in this component only
            },
          }),
        )}
      >
        <div className="min-w-64 flex-1">
          <Field label="Token name" htmlFor="token-name" hint="What will use it, e.g. “nightly setup script”." error={nameError}>
            <Input id="token-name" maxLength={80} {...invalidProps('token-name', nameError)} {...form.register('name')} />
          </Field>
        </div>
        <Button type="submit" variant="primary" busy={create.isPending}>
          Create token
        </Button>
      </form>
      {create.isError && !nameError && (
        <p role="alert" className="text-sm text-changes">
          {create.error.message}
        </p>
      )}
      {shown && <NewSecret name={shown.name} secret={shown.secret} onDone={() => setShown(null)} />}
      {tokens.isPending ? (
        <LoadingState />
      ) : tokens.isError ? (
        <ErrorState error={tokens.error} onRetry={() => tokens.refetch()} />
      ) : tokens.data.length === 0 ? (
        <EmptyState title="No tokens yet">A token lets a script read the catalog and download exports as you, and nothing else.</EmptyState>
      ) : (
        <table className="w-full text-sm" aria-label="Your API tokens">
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr>
              <th className="py-1.5 text-left">Name</th>
              <th className="text-left">Starts with</th>
              <th className="text-left">Created</th>
              <th className="text-left">Last used</th>
              <th className="text-left">State</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {tokens.data.map((t) => (
              <TokenRow key={t.id} token={t} />
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
