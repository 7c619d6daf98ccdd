'use client';
import Link from 'next/link';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage } from '@/components/ui/field';
import { signInAction } from '@/app/(auth)/sign-in/actions';

export function SignInForm({ next }: { next?: string }) {
  const [state, action, pending] = useActionState(signInAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <input type="hidden" name="next" value={next ?? ''} />
      <Field label="E-mail" name="email" type="email" autoComplete="email" required defaultValue={state.values?.email} errors={state.fieldErrors?.email} />
      <Field label="Password" name="password" type="password" autoComplete="current-password" required errors={state.fieldErrors?.password} />
      <Button type="submit" disabled={pending}>
        {pending ? 'Signing in…' : 'Sign in'}
      </Button>
      <div className="flex justify-between text-xs">
        <Link href="/reset" className="text-tide-600 hover:underline">
          Forgotten password?
        </Link>
        <Link href="/sign-up" className="text-tide-600 hover:underline">
          Create an account
        </Link>
      </div>
    </form>
  );
}
