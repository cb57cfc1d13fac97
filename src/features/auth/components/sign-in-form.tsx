import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { signInBody, type SignInBody } from '@shared/schemas/people';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { useSignIn } from '../api/sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const form = useForm<SignInBody>({ resolver: zodResolver(signInBody), defaultValues: { email: '', password: '' } });
  const errors = form.formState.errors;
  return (
    <form
      noValidate
      onSubmit={form.handleSubmit((values) => signIn.mutate(values, { onSuccess: onSignedIn }))}
      className="flex flex-col gap-4"
    >
      <Field label="E-mail" htmlFor="email" error={errors.email?.message}>
        <Input id="email" type="email" autoComplete="username" autoFocus aria-invalid={!!errors.email} {...form.register('email')} />
      </Field>
      <Field label="Password" htmlFor="password" error={errors.password?.message}>
        <Input
          id="password"
          type="password"
          autoComplete="current-password"
          aria-invalid={!!errors.password}
          {...form.register('password')}
        />
      </Field>
      {signIn.isError && (
        <p role="alert" className="rounded-md bg-changes-soft px-3 py-2 text-sm text-changes">
          {signIn.error.message}
        </p>
      )}
      <Button type="submit" variant="primary" busy={signIn.isPending} className="mt-1 py-2">
        Sign in
      </Button>
    </form>
  );
}
