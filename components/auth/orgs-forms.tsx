'use client';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { createOrganisationAction, resendVerificationAction } from '@/app/orgs/actions';

export function CreateOrganisationForm() {
  const form = useBoundAction(createOrganisationAction);
  return (
    <ActionForm form={form} className="flex flex-col gap-3" noValidate>
      <Field label="Organisation name" {...form.field('name')} required placeholder="e.g. your fleet operator, port authority or consultancy" />
      <Button type="submit" disabled={form.pending}>
        Create organisation
      </Button>
    </ActionForm>
  );
}

export function ResendVerificationForm() {
  const form = useBoundAction(resendVerificationAction);
  return (
    <ActionForm form={form} className="flex flex-col gap-2">
      <Button type="submit" variant="secondary" disabled={form.pending}>
        Send the link again
      </Button>
    </ActionForm>
  );
}
