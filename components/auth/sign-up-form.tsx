'use client';
import Link from 'next/link';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { signUpAction } from '@/app/(auth)/sign-up/actions';

export function SignUpForm() {
  const form = useBoundAction(signUpAction);
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <Field label="Your name" {...form.field('name')} autoComplete="name" required />
      <Field label="Work e-mail" {...form.field('email')} type="email" autoComplete="email" required />
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 10 characters; not a commonly used password."
        errors={form.errors('password')}
      />
      <Button type="submit" disabled={form.pending}>
        {form.pending ? 'Creating…' : 'Create account'}
      </Button>
      <p className="text-xs text-ink-soft">
        We send a link to confirm your address; then you create your organisation.{' '}
        <Link href="/sign-in" className="text-tide-600 hover:underline">
          I already have an account
        </Link>
      </p>
    </ActionForm>
  );
}
