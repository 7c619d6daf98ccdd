'use client';
import { useActionState } from 'react';
import { Button } from '@/components/ui/button';
import { FormMessage } from '@/components/ui/field';
import type { ActionState } from '@/lib/server/action';

/** A single button that posts a token: links in e-mails never change anything on a plain GET. */
export function TokenConfirmForm({ token, label, action }: { token: string; label: string; action: (state: ActionState, formData: FormData) => Promise<ActionState> }) {
  const [state, formAction, pending] = useActionState(action, { ok: false });
  return (
    <form action={formAction} className="flex flex-col gap-3">
      <FormMessage state={state} />
      <input type="hidden" name="token" value={token} />
      <Button type="submit" disabled={pending}>
        {label}
      </Button>
    </form>
  );
}
