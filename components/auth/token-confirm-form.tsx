'use client';
import { Button } from '@/components/ui/button';
import { ActionForm, useBoundAction, type BoundAction } from '@/components/ui/action-form';

/** A single button that posts a token: links in e-mails never change anything on a plain GET. */
export function TokenConfirmForm({ token, label, action }: { token: string; label: string; action: BoundAction }) {
  const form = useBoundAction(action);
  return (
    <ActionForm form={form} className="flex flex-col gap-3">
      <input type="hidden" name="token" value={token} />
      <Button type="submit" disabled={form.pending}>
        {label}
      </Button>
    </ActionForm>
  );
}
