'use client';
import { useEffect, useRef } from 'react';
import { Button } from '@/components/ui/button';
import { ActionForm, useBoundAction, type BoundAction } from '@/components/ui/action-form';

/**
 * A single button that posts a token: links in e-mails never change anything on a plain GET (mail
 * scanners and link previews fetch them). With `submitOnOpen` the page posts it by itself once its
 * scripts run, so a person who opens the link is done in one click; a fetcher that runs no scripts
 * changes nothing, and without scripts the button is still there.
 */
export function TokenConfirmForm({ token, label, action, submitOnOpen = false }: { token: string; label: string; action: BoundAction; submitOnOpen?: boolean }) {
  const form = useBoundAction(action);
  const element = useRef<HTMLFormElement>(null);
  const sent = useRef(false);
  useEffect(() => {
    // Once, and only when the form carries its key (set in the browser after hydration).
    if (!submitOnOpen || sent.current || !form.idempotencyKey) return;
    sent.current = true;
    element.current?.requestSubmit();
  }, [submitOnOpen, form.idempotencyKey]);
  return (
    <ActionForm ref={element} form={form} className="flex flex-col gap-3">
      <input type="hidden" name="token" value={token} />
      {submitOnOpen && form.pending ? (
        <p role="status" className="text-sm text-ink-soft">
          Confirming…
        </p>
      ) : null}
      <Button type="submit" disabled={form.pending}>
        {label}
      </Button>
    </ActionForm>
  );
}
