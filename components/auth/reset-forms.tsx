'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage } from '@/components/ui/field';
import { requestResetAction, resetPasswordAction } from '@/app/(auth)/reset/actions';

export function RequestResetForm() {
  const [state, action, pending] = useActionState(requestResetAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <Field label="E-mail" name="email" type="email" autoComplete="email" required defaultValue={state.values?.email} errors={state.fieldErrors?.email} />
      <Button type="submit" disabled={pending}>
        Send me a reset link
      </Button>
    </form>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const [state, action, pending] = useActionState(resetPasswordAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <Field label="New password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters; not a commonly used password." errors={state.fieldErrors?.password} />
      <Button type="submit" disabled={pending}>
        Set the new password
      </Button>
      <p className="text-xs text-ink-faint">Every device signed in to your account will be signed out.</p>
    </form>
  );
}
