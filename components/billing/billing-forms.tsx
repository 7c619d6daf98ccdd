'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';
import { cancelAction, checkoutAction, portalAction } from '@/app/o/[org]/billing/actions';

type Bound = (state: ActionState, formData: FormData) => Promise<ActionState>;

export function ChoosePlanButton({ org, plan, label, current }: { org: string; plan: string; label: string; current: boolean }) {
  const [state, action, pending] = useActionState(checkoutAction.bind(null, org) as Bound, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-2">
      <FormMessage state={state} />
      <input type="hidden" name="plan" value={plan} />
      <Button type="submit" variant={current ? 'secondary' : 'primary'} disabled={pending || current}>
        {current ? 'Your plan' : pending ? 'Opening checkout…' : label}
      </Button>
    </form>
  );
}

export function PortalButton({ org }: { org: string }) {
  const [state, action, pending] = useActionState(portalAction.bind(null, org) as Bound, { ok: false });
  return (
    <form action={action} className="flex flex-col gap-2">
      <FormMessage state={state} />
      <Button type="submit" variant="secondary" disabled={pending}>
        Manage the subscription and payment
      </Button>
    </form>
  );
}

export function CancelButton({ org, cancelling }: { org: string; cancelling: boolean }) {
  const [state, action, pending] = useActionState(cancelAction.bind(null, org) as Bound, { ok: false });
  return (
    <form
      action={action}
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        if (!cancelling && !confirm('Cancel at the end of the paid period? The organisation then becomes read-only; nothing is deleted.')) e.preventDefault();
      }}
    >
      <FormMessage state={state} />
      <input type="hidden" name="cancel" value={cancelling ? '0' : '1'} />
      <Button type="submit" variant={cancelling ? 'secondary' : 'danger'} disabled={pending}>
        {cancelling ? 'Keep the subscription' : 'Cancel at period end'}
      </Button>
    </form>
  );
}
