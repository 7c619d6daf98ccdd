import { getEnv } from '@/lib/server/env';
import { mayUseDevInbox } from '@/lib/server/dev-inbox';

// GET /dev/inbox/[id]/attachments/[index]: an attachment from the SMTP fake (same conditions as the inbox page).
export async function GET(_req: Request, { params }: { params: Promise<{ id: string; index: string }> }) {
  const env = getEnv();
  if (!(await mayUseDevInbox()) || !env.FAKE_MAIL_API) return new Response('Not found', { status: 404 });
  const { id, index } = await params;
  if (!/^[\w-]+$/.test(id) || !/^\d+$/.test(index)) return new Response('Not found', { status: 404 });
  const res = await fetch(`${env.FAKE_MAIL_API}/messages/${id}/attachments/${index}`);
  return new Response(res.body, { status: res.status, headers: { 'content-type': res.headers.get('content-type') ?? 'application/octet-stream', 'content-disposition': res.headers.get('content-disposition') ?? 'attachment' } });
}
