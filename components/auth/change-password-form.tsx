'use client';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { changePasswordAction } from '@/app/o/[org]/account/actions';

export function ChangePasswordForm() {
  const form = useBoundAction(changePasswordAction);
  return (
    <ActionForm form={form} className="flex max-w-sm flex-col gap-3" noValidate>
      <Field label="Current password" name="currentPassword" type="password" autoComplete="current-password" errors={form.errors('currentPassword')} />
      <Field label="New password" name="password" type="password" autoComplete="new-password" hint="At least 10 characters; not a commonly used password." errors={form.errors('password')} />
      <Button type="submit" disabled={form.pending}>
        Change password
      </Button>
    </ActionForm>
  );
}
