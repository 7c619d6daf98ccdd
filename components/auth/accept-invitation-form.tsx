'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage } from '@/components/ui/field';
import { acceptInvitationNewUserAction } from '@/app/(auth)/invite/[token]/actions';

export function AcceptInvitationNewUserForm({ token, email }: { token: string; email: string }) {
  const [state, action, pending] = useActionState(acceptInvitationNewUserAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <Field label="E-mail" name="email-shown" value={email} readOnly disabled />
      <Field label="Your name" name="name" autoComplete="name" required defaultValue={state.values?.name} errors={state.fieldErrors?.name} />
      <Field label="Choose a password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters; not a commonly used password." errors={state.fieldErrors?.password} />
      <Button type="submit" disabled={pending}>
        Create my account and join
      </Button>
    </form>
  );
}
