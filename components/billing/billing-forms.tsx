'use client';
import { Button } from '@/components/ui/button';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { cancelAction, checkoutAction, portalAction } from '@/app/o/[org]/billing/actions';

export function ChoosePlanButton({ org, plan, label, current, change = false }: { org: string; plan: string; label: string; current: boolean; change?: boolean }) {
  const form = useBoundAction(checkoutAction.bind(null, org));
  return (
    <ActionForm form={form} className="flex flex-col gap-2">
      <input type="hidden" name="plan" value={plan} />
      <Button type="submit" variant={current ? 'secondary' : 'primary'} disabled={form.pending || current}>
        {current ? 'Your plan' : form.pending ? (change ? 'Changing the plan…' : 'Opening checkout…') : label}
      </Button>
    </ActionForm>
  );
}

export function PortalButton({ org }: { org: string }) {
  const form = useBoundAction(portalAction.bind(null, org));
  return (
    <ActionForm form={form} className="flex flex-col gap-2">
      <Button type="submit" variant="secondary" disabled={form.pending}>
        Manage the subscription and payment
      </Button>
    </ActionForm>
  );
}

export function CancelButton({ org, cancelling }: { org: string; cancelling: boolean }) {
  const form = useBoundAction(cancelAction.bind(null, org));
  return (
    <ActionForm
      form={form}
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        if (!cancelling && !confirm('Cancel at the end of the paid period? The organisation then becomes read-only; nothing is deleted.')) e.preventDefault();
      }}
    >
      <input type="hidden" name="cancel" value={cancelling ? '0' : '1'} />
      <Button type="submit" variant={cancelling ? 'secondary' : 'danger'} disabled={form.pending}>
        {cancelling ? 'Keep the subscription' : 'Cancel at period end'}
      </Button>
    </ActionForm>
  );
}
