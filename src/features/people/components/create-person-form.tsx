import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { ROLE_LABELS, ROLES } from '@shared/auth/roles';
import { createPersonBody, type CreatePersonBody } from '@shared/schemas/people';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { useCreatePerson } from '../api/people';

export function CreatePersonForm() {
  const create = useCreatePerson();
  const form = useForm<CreatePersonBody>({
    resolver: zodResolver(createPersonBody),
    defaultValues: { email: '', name: '', roles: ['consumer'], password: '' },
  });
  const errors = form.formState.errors;
  return (
    <form
      noValidate
      className="grid gap-4"
      onSubmit={form.handleSubmit((values) => create.mutate(values, { onSuccess: () => form.reset() }))}
    >
      <Field label="Name" htmlFor="person-name" error={errors.name?.message}>
        <Input id="person-name" aria-invalid={!!errors.name} {...form.register('name')} />
      </Field>
      <Field label="E-mail" htmlFor="person-email" error={errors.email?.message}>
        <Input id="person-email" type="email" aria-invalid={!!errors.email} {...form.register('email')} />
      </Field>
      <Field
        label="Initial password"
        htmlFor="person-password"
        error={errors.password?.message}
        hint="At least 12 characters; tell it to the person yourself. It is stored only as a hash."
      >
        <Input
          id="person-password"
          type="password"
          autoComplete="new-password"
          aria-invalid={!!errors.password}
          {...form.register('password')}
        />
      </Field>
      <fieldset>
        <legend className="text-sm font-semibold">Roles</legend>
        <div className="mt-1 flex flex-wrap gap-4">
          {ROLES.map((role) => (
            <label key={role} className="flex items-center gap-2 text-sm">
              <input type="checkbox" value={role} {...form.register('roles')} className="accent-copper" />
              {ROLE_LABELS[role]}
            </label>
          ))}
        </div>
        {errors.roles && <p className="text-sm text-changes">{errors.roles.message}</p>}
      </fieldset>
      {create.isError && (
        <p role="alert" className="text-sm text-changes">
          {create.error.message}
        </p>
      )}
      {create.isSuccess && (
        <p role="status" className="text-sm text-approved">
          Added {create.data.email}.
        </p>
      )}
      <div>
        <Button type="submit" variant="primary" busy={create.isPending}>
          Add person
        </Button>
      </div>
    </form>
  );
}
