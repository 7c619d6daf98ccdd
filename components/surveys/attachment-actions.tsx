'use client';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { ActionForm, useBoundAction } from '@/components/ui/action-form';
import { useRouter } from 'next/navigation';
import { deleteAttachmentAction, restoreAttachmentAction, updateAttachmentAction } from '@/app/o/[org]/surveys/actions';
import { announce, undoBy, UNDO_SECONDS } from '@/components/ui/toast';
import type { ActionState } from '@/lib/server/action';
import { ConfirmDelete } from './confirm-delete';

/** Change an attachment's caption, or delete it (after a confirmation). */
export function AttachmentActions({ org, surveyId, attachment }: { org: string; surveyId: string; attachment: { id: string; filename: string; caption: string | null } }) {
  const [editing, setEditing] = useState(false);
  const form = useBoundAction(updateAttachmentAction.bind(null, org));
  const router = useRouter();
  // The delete, then its Undo in the page's notice (this control is gone with the attachment once the page refreshes).
  const deleteWithUndo = async (prev: ActionState, formData: FormData): Promise<ActionState> => {
    const answer = await deleteAttachmentAction(org, prev, formData);
    if (!answer.ok || answer.data?.undoAttachmentId !== attachment.id) return answer;
    announce({
      ok: true,
      message: answer.message ?? `${attachment.filename} deleted.`,
      undo: {
        label: `Undo: put back ${attachment.filename}`,
        run: undoBy(restoreAttachmentAction.bind(null, org), { surveyId, attachmentId: attachment.id }, () => router.refresh()),
      },
    });
    return answer;
  };
  return (
    <div className="mt-1 flex flex-col gap-1">
      {editing ? (
        <ActionForm form={form} className="flex flex-col gap-1" aria-label={`Caption of ${attachment.filename}`}>
          <input type="hidden" name="surveyId" value={surveyId} />
          <input type="hidden" name="attachmentId" value={attachment.id} />
          <Field label="Caption" {...form.field('caption', attachment.caption ?? '')} />
          <span className="flex gap-1">
            <Button type="submit" variant="secondary" className="text-xs" disabled={form.pending}>
              Save
            </Button>
            <Button type="button" variant="ghost" className="text-xs" onClick={() => setEditing(false)}>
              Close
            </Button>
          </span>
        </ActionForm>
      ) : (
        <span className="flex flex-wrap gap-1">
          <Button type="button" variant="secondary" className="text-xs" onClick={() => setEditing(true)}>
            Edit caption
          </Button>
          <ConfirmDelete action={deleteWithUndo} fields={{ surveyId, attachmentId: attachment.id }} what={attachment.filename} consequence={`You can undo it for ${UNDO_SECONDS} seconds.`} />
        </span>
      )}
    </div>
  );
}
