'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { Field, FormMessage } from '@/components/ui/field';
import { createOrganisationAction, resendVerificationAction } from '@/app/orgs/actions';

export function CreateOrganisationForm() {
  const [state, action, pending] = useActionState(createOrganisationAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-3" noValidate>
      <FormMessage state={state} />
      <Field label="Organisation name" name="name" required placeholder="e.g. your fleet operator, port authority or consultancy" defaultValue={state.values?.name} errors={state.fieldErrors?.name} />
      <Button type="submit" disabled={pending}>
        Create organisation
      </Button>
    </form>
  );
}

export function ResendVerificationForm() {
  const [state, action, pending] = useActionState(resendVerificationAction, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-2">
      <FormMessage state={state} />
      <Button type="submit" variant="secondary" disabled={pending}>
        Send the link again
      </Button>
    </form>
  );
}
