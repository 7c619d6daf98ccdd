'use client';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { requestResetAction, resetPasswordAction } from '@/app/(auth)/reset/actions';

export function RequestResetForm() {
  const form = useBoundAction(requestResetAction);
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <Field label="E-mail" {...form.field('email')} type="email" autoComplete="email" required />
      <Button type="submit" disabled={form.pending}>
        Send me a reset link
      </Button>
    </ActionForm>
  );
}

export function ResetPasswordForm({ token }: { token: string }) {
  const form = useBoundAction(resetPasswordAction);
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="token" value={token} />
      <Field label="New password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters; not a commonly used password." errors={form.errors('password')} />
      <Button type="submit" disabled={form.pending}>
        Set the new password
      </Button>
      <p className="text-xs text-ink-faint">Every device signed in to your account will be signed out.</p>
    </ActionForm>
  );
}
