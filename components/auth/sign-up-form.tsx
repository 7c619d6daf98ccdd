'use client';
import Link from 'next/link';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage } from '@/components/ui/field';
import { signUpAction } from '@/app/(auth)/sign-up/actions';

export function SignUpForm() {
  const [state, action, pending] = useActionState(signUpAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <Field label="Your name" name="name" autoComplete="name" required defaultValue={state.values?.name} errors={state.fieldErrors?.name} />
      <Field label="Work e-mail" name="email" type="email" autoComplete="email" required defaultValue={state.values?.email} errors={state.fieldErrors?.email} />
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 10 characters; not a commonly used password."
        errors={state.fieldErrors?.password}
      />
      <Button type="submit" disabled={pending}>
        {pending ? 'Creating…' : 'Create account'}
      </Button>
      <p className="text-xs text-ink-soft">
        We send a link to confirm your address; then you create your organisation.{' '}
        <Link href="/sign-in" className="text-tide-600 hover:underline">
          I already have an account
        </Link>
      </p>
    </form>
  );
}
