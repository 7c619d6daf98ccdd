'use client';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { deleteAttachmentAction, updateAttachmentAction } from '@/app/o/[org]/surveys/actions';
import { ConfirmDelete } from './confirm-delete';

/** Change an attachment's caption, or delete it (after a confirmation). */
export function AttachmentActions({ org, surveyId, attachment }: { org: string; surveyId: string; attachment: { id: string; filename: string; caption: string | null } }) {
  const [editing, setEditing] = useState(false);
  const form = useBoundAction(updateAttachmentAction.bind(null, org));
  return (
    <div className="mt-1 flex flex-col gap-1">
      {editing ? (
        <ActionForm form={form} className="flex flex-col gap-1" aria-label={`Caption of ${attachment.filename}`}>
          <input type="hidden" name="surveyId" value={surveyId} />
          <input type="hidden" name="attachmentId" value={attachment.id} />
          <Field label="Caption" {...form.field('caption', attachment.caption ?? '')} />
          <span className="flex gap-1">
            <Button type="submit" variant="secondary" className="px-2 py-0.5 text-xs" disabled={form.pending}>
              Save
            </Button>
            <Button type="button" variant="ghost" className="px-2 py-0.5 text-xs" onClick={() => setEditing(false)}>
              Close
            </Button>
          </span>
        </ActionForm>
      ) : (
        <span className="flex flex-wrap gap-1">
          <Button type="button" variant="secondary" className="px-2 py-0.5 text-xs" onClick={() => setEditing(true)}>
            Edit caption
          </Button>
          <ConfirmDelete action={deleteAttachmentAction.bind(null, org)} fields={{ surveyId, attachmentId: attachment.id }} what={attachment.filename} consequence="The file cannot be restored on its own." />
        </span>
      )}
    </div>
  );
}
