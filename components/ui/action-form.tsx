'use client';
import { useActionState, useCallback, useEffect, useState } from 'react';
import type { ActionState } from '@/lib/server/action';
import { useInvalidateOnSuccess } from '@/lib/client/use-invalidate-on-success';
import { IDEMPOTENCY_FIELD, newIdempotencyKey } from '@/lib/client/idempotency-key';
import { FormMessage } from './field';

/** A server action as a form runs it: an organisation action with its slug bound (`action.bind(null, org)`), or a public one. */
export type BoundAction = (state: ActionState, formData: FormData) => Promise<ActionState>;

type QueryKey = readonly unknown[];

interface Options {
  /** What the fields show before anything is submitted, and again after a success. */
  initial?: Record<string, string | undefined>;
  /** Cached queries the action changes: dropped when it succeeds so tables fetch them again. */
  invalidate?: readonly QueryKey[];
  /**
   * Re-render the page's server components after a success (default). Off where the service revalidates
   * the page itself, so the answer already carries the fresh page and it is not rendered twice.
   */
  refresh?: boolean;
}

export interface BoundForm {
  state: ActionState;
  action: (formData: FormData) => void;
  pending: boolean;
  /** The values typed before a refused submit (never passwords), else `initial`. */
  values: Record<string, string | undefined>;
  errors: (name: string) => string[] | undefined;
  /**
   * The key this submit carries (a hidden field): the same for a double click or a browser retry, so the
   * server writes once and answers both with the first result; renewed once a submit has been answered.
   */
  idempotencyKey: string;
  /**
   * The action as React gives it (no wrapper), for ActionForm: the form then works before the page's
   * scripts have loaded too (React renders the action's hidden fields), and the key travels in the
   * hidden field ActionForm renders.
   */
  formAction: (formData: FormData) => void;
  /** name, kept value and errors for a Field or SelectField: `<Field label="…" {...form.field('yard')} />`. */
  field: (name: string, fallback?: string) => { name: string; defaultValue: string | undefined; errors: string[] | undefined };
}

/**
 * The one wiring between a server action and its form: useActionState, the field errors, the values
 * kept after a refusal (the server only sends them back with `ok: false`) and, on success, the
 * cached lists to refresh.
 */
export function useBoundAction(bound: BoundAction, { initial = {}, invalidate = [], refresh = true }: Options = {}): BoundForm {
  const [state, dispatch, pending] = useActionState(bound, { ok: false });
  useInvalidateOnSuccess(state, invalidate, { refresh });
  // Made in the browser (never during the server render, so the page hydrates as rendered); a new one for
  // each answered submit, so a deliberate second submit is a new write.
  const [idempotencyKey, setIdempotencyKey] = useState('');
  useEffect(() => setIdempotencyKey(newIdempotencyKey()), [state]);
  // Every form wired here carries the key, whether or not it renders the hidden field.
  const action = useCallback(
    (formData: FormData) => {
      if (!formData.get(IDEMPOTENCY_FIELD)) formData.set(IDEMPOTENCY_FIELD, idempotencyKey || newIdempotencyKey());
      dispatch(formData);
    },
    [dispatch, idempotencyKey],
  );
  const values = state.values ?? initial;
  const errors = (name: string) => state.fieldErrors?.[name];
  return { state, action, formAction: dispatch, pending, idempotencyKey, values, errors, field: (name, fallback) => ({ name, defaultValue: values[name] ?? fallback, errors: errors(name) }) };
}

interface ActionFormProps extends Omit<React.FormHTMLAttributes<HTMLFormElement>, 'action'> {
  form: Pick<BoundForm, 'state' | 'action'> & Partial<Pick<BoundForm, 'idempotencyKey' | 'formAction'>>;
  /** Wraps the message in a div with this class (e.g. a column span in a grid form). */
  messageClassName?: string;
  ref?: React.Ref<HTMLFormElement>;
}

/** A form posting to its bound action, with the action's message (role status or alert) first. */
export function ActionForm({ form, messageClassName, children, ...props }: ActionFormProps) {
  const message = <FormMessage state={form.state} />;
  return (
    <form action={form.formAction ?? form.action} {...props}>
      {form.idempotencyKey ? <input type="hidden" name={IDEMPOTENCY_FIELD} value={form.idempotencyKey} readOnly /> : null}
      {messageClassName ? <div className={messageClassName}>{message}</div> : message}
      {children}
    </form>
  );
}

/** A refusal beside a small button form (archive, remove, accept…); nothing when the action succeeded. */
export function ActionError({ state, className }: { state: ActionState; className?: string }) {
  if (!state.message || state.ok) return null;
  return (
    <span role="alert" className={className ? `${className} text-xs text-state-action` : 'text-xs text-state-action'}>
      {state.message}
    </span>
  );
}
