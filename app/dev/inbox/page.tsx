import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { getEnv } from '@/lib/server/env';
import { getEm } from '@/lib/server/db';
import { listWaitingMail } from '@/lib/server/mail/outbox';
import { mayUseDevInbox } from '@/lib/server/dev-inbox';

// Named only when it is shown: the 404 answered otherwise must not say what is here.
export async function generateMetadata(): Promise<Metadata> {
  return (await mayUseDevInbox()) ? { title: 'Dev inbox' } : {};
}
export const dynamic = 'force-dynamic';

interface FakeMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  attachments: { filename: string; contentType: string; size: number }[];
}

const linkify = (text: string) =>
  text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="break-all text-tide-600 underline">
        {part}
      </a>
    ) : (
      <span key={i}>{part}</span>
    ),
  );

// What the SMTP fake received, plus the outbox state: only while mail goes to the local fake, and only
// for a request from this machine (see lib/server/dev-inbox.ts); otherwise the page does not exist.
export default async function DevInboxPage() {
  if (!(await mayUseDevInbox())) notFound();
  const env = getEnv();
  if (!env.FAKE_MAIL_API) notFound();
  let messages: FakeMessage[] = [];
  let unreachable = false;
  try {
    const res = await fetch(`${env.FAKE_MAIL_API}/messages`, { cache: 'no-store' });
    messages = await res.json();
  } catch {
    unreachable = true;
  }
  const waiting = await listWaitingMail(await getEm());
  return (
    <main id="content" tabIndex={-1} className="mx-auto max-w-4xl px-4 py-8 outline-none sm:px-6">
      <h1 className="text-2xl font-semibold">Dev inbox</h1>
      <p className="mb-4 text-sm text-ink-soft">Every e-mail the local SMTP fake received, newest first. Only shown while mail goes to the local fake, and only on this machine.</p>
      {unreachable ? <p role="alert" className="mb-4 text-sm text-state-action">The SMTP fake is not reachable at {env.FAKE_MAIL_API}.</p> : null}
      {waiting.length ? (
        <section className="mb-6 rounded-[4px] border border-state-soon/40 bg-state-soonbg p-3 text-sm">
          <h2 className="font-semibold text-state-soon">Outbox: {waiting.length} not delivered yet</h2>
          <ul className="mt-1 text-xs">
            {waiting.map((m) => (
              <li key={m.id}>
                {m.status} · {m.toAddress} · {m.subject} · attempts {m.attempts}
                {m.lastError ? ` · last error: ${m.lastError}` : ''}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <ol className="flex flex-col gap-3">
        {messages.map((m) => (
          <li key={m.id} className="rounded-[4px] border border-rule bg-paper-raised p-4" data-testid="inbox-message">
            <p className="text-xs text-ink-faint">
              {new Date(m.receivedAt).toISOString().replace('T', ' ').slice(0, 19)} UTC · to {m.to.join(', ')}
            </p>
            <h2 className="font-semibold">{m.subject}</h2>
            <pre className="mt-2 whitespace-pre-wrap font-sans text-sm">{linkify(m.text)}</pre>
            {m.attachments.length ? (
              <p className="mt-2 text-xs">
                Attachments:{' '}
                {m.attachments.map((a, i) => (
                  <a key={i} href={`/dev/inbox/${m.id}/attachments/${i}`} className="mr-2 text-tide-600 underline">
                    {a.filename}
                  </a>
                ))}
              </p>
            ) : null}
          </li>
        ))}
      </ol>
      {!messages.length && !unreachable ? <p className="text-sm text-ink-faint">No messages yet.</p> : null}
    </main>
  );
}
