'use client';
import { useEffect } from 'react';
import { useRouter } from 'next/navigation';
import { useQueryClient } from '@tanstack/react-query';
import { NoticeBar, undoBy, useNotice } from '@/components/ui/toast';
import { undoDeleteSurveyAction } from '@/app/o/[org]/surveys/actions';
import { queryKeys } from '@/lib/client/query-client';

/**
 * The confirmation on the surveys list after "Delete the survey" (the delete navigates here, so the notice
 * is given by this page, not by the button that is gone), with its Undo while it lasts.
 */
export function SurveyDeletedNotice({ org, surveyId }: { org: string; surveyId: string }) {
  const router = useRouter();
  const client = useQueryClient();
  const { notice, show } = useNotice();
  useEffect(() => {
    show({
      ok: true,
      message: 'Survey deleted. An engineer can restore it within 30 days.',
      undo: {
        label: 'Undo: put the survey back',
        // The answer is said in the page-wide notice, which stays on this page while the address stops naming a
        // deleted survey (a reload must not say it was deleted) and this notice goes with it.
        run: undoBy(undoDeleteSurveyAction.bind(null, org), { surveyId }, async (answer) => {
          if (!answer.ok) return;
          await client.invalidateQueries({ queryKey: queryKeys.surveys(org) });
          router.replace(`/o/${org}/surveys`);
        }),
      },
    });
    // Once per deleted survey.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [org, surveyId]);
  return (
    <div className="mb-4">
      <NoticeBar notice={notice} />
    </div>
  );
}
