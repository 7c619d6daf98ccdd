'use client';
import { useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '@/components/ui/button';
import { ActionError, useBoundAction, type BoundAction } from '@/components/ui/action-form';
import { useFocusListAfterRemoval } from '@/components/ui/focus-after-removal';

/**
 * A delete in two steps: "Delete" asks, in the page, what goes and whether it can come back; only
 * "Yes, delete" submits. Hidden fields name the record.
 */
export function ConfirmDelete({ action, fields, what, consequence, label = 'Delete', invalidate = [] }: { action: BoundAction; fields: Record<string, string>; what: string; consequence: string; label?: string; invalidate?: readonly (readonly unknown[])[] }) {
  const [asking, setAsking] = useState(false);
  const client = useQueryClient();
  const { state, action: submit, pending } = useBoundAction(action, { invalidate });
  // Focus follows the step: "Delete" moves it to "Keep it" (the safe answer), "Keep it" back to "Delete"; once the
  // record is gone (this control unmounts with its row) it goes to the list it was in, not to the page body.
  const box = useRef<HTMLElement | null>(null);
  const moved = useRef(false);
  const rememberList = useFocusListAfterRemoval();
  useEffect(() => {
    if (!moved.current) return;
    box.current?.querySelector<HTMLButtonElement>(asking ? 'button[type="button"]' : 'button')?.focus();
  }, [asking]);
  const ask = (value: boolean) => {
    moved.current = true;
    setAsking(value);
  };
  if (!asking) {
    return (
      <span ref={box} className="inline-flex items-center gap-2">
        <Button type="button" variant="danger" className="text-xs" onClick={() => ask(true)}>
          {label}
          {/* Named for what it deletes: a row of "Delete" buttons reads as "Delete the reading at DS-4", … */}
          {label === 'Delete' ? <span className="sr-only"> {what}</span> : null}
        </Button>
        <ActionError state={state} />
      </span>
    );
  }
  return (
    <form
      ref={(el) => {
        box.current = el;
      }}
      action={submit}
      // A delete that navigates away (the survey) never reports success here: drop the cached lists as it is sent.
      onSubmit={(ev) => {
        rememberList(ev.currentTarget);
        for (const queryKey of invalidate) client.removeQueries({ queryKey });
      }}
      className="inline-flex flex-wrap items-center gap-2 text-xs" role="group" aria-label={`Delete ${what}`}>
      {Object.entries(fields).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      <span>
        Delete {what}? {consequence}
      </span>
      <Button type="submit" variant="danger" className="text-xs" disabled={pending}>
        Yes, delete
      </Button>
      <Button type="button" variant="secondary" className="text-xs" onClick={() => ask(false)}>
        Keep it
      </Button>
      <ActionError state={state} />
    </form>
  );
}
