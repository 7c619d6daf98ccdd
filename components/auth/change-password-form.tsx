'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage } from '@/components/ui/field';
import { changePasswordAction } from '@/app/o/[org]/account/actions';

export function ChangePasswordForm() {
  const [state, action, pending] = useActionState(changePasswordAction, { ok: false });
  return (
    <form action={action} className="flex max-w-sm flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <Field label="Current password" name="currentPassword" type="password" autoComplete="current-password" errors={state.fieldErrors?.currentPassword} />
      <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters; not a commonly used password." errors={state.fieldErrors?.password} />
      <Button type="submit" disabled={pending}>
        Change password
      </Button>
    </form>
  );
}
