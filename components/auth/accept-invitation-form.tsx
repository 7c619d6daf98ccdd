'use client';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { acceptInvitationNewUserAction } from '@/app/(auth)/invite/[token]/actions';

export function AcceptInvitationNewUserForm({ token, email }: { token: string; email: string }) {
  const form = useBoundAction(acceptInvitationNewUserAction);
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="token" value={token} />
      <Field label="E-mail" name="email-shown" value={email} readOnly disabled />
      <Field label="Your name" {...form.field('name')} autoComplete="name" required />
      <Field label="Choose a password" name="password" type="password" autoComplete="new-password" required hint="At least 10 characters; not a commonly used password." errors={form.errors('password')} />
      <Button type="submit" disabled={form.pending}>
        Create my account and join
      </Button>
    </ActionForm>
  );
}
