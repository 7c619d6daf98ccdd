'use client';
import Link from 'next/link';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { signInAction } from '@/app/(auth)/sign-in/actions';

export function SignInForm({ next }: { next?: string }) {
  const form = useBoundAction(signInAction);
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="next" value={next ?? ''} />
      <Field label="E-mail" {...form.field('email')} type="email" autoComplete="email" required />
      <Field label="Password" name="password" type="password" autoComplete="current-password" required errors={form.errors('password')} />
      <Button type="submit" disabled={form.pending}>
        {form.pending ? 'Signing in…' : 'Sign in'}
      </Button>
      <div className="flex justify-between text-xs">
        <Link href="/reset" className="text-tide-600 hover:underline">
          Forgotten password?
        </Link>
        <Link href="/sign-up" className="text-tide-600 hover:underline">
          Create an account
        </Link>
      </div>
    </ActionForm>
  );
}
