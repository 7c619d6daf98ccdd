// Local stand-in for an SMTP relay: accepts every message on FAKE_SMTP_PORT and keeps it in memory.
// Its HTTP side (FAKE_MAIL_API_PORT) lists what it received for the dev inbox and the tests, and
// can be switched "down" so that the app's outbox retry is exercised.
import http from 'node:http';
import { randomUUID } from 'node:crypto';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';

interface StoredMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  attachments: { filename: string; contentType: string; size: number; content: Buffer }[];
}

const smtpPort = Number(process.env.FAKE_SMTP_PORT ?? 2525);
const apiPort = Number(process.env.FAKE_MAIL_API_PORT ?? 2526);
const messages: StoredMessage[] = [];
let isDown = false;
const MAX_KEPT = 2000;

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  logger: false,
  size: 25 * 1024 * 1024,
  onConnect(_session, callback) {
    if (isDown) return callback(Object.assign(new Error('Service temporarily unavailable (fake is down)'), { responseCode: 421 }));
    callback();
  },
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        messages.push({
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject ?? '',
          text: parsed.text ?? '',
          html: typeof parsed.html === 'string' ? parsed.html : null,
          attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size, content: a.content })),
        });
        if (messages.length > MAX_KEPT) messages.splice(0, messages.length - MAX_KEPT);
        callback();
      })
      .catch((error: Error) => callback(error));
  },
});

const api = http.createServer((req, res) => {
  const url = new URL(req.url ?? '/', 'http://localhost');
  const send = (status: number, body: unknown) => {
    res.writeHead(status, { 'content-type': 'application/json' });
    res.end(JSON.stringify(body));
  };
  if (req.method === 'GET' && url.pathname === '/messages') {
    const to = url.searchParams.get('to')?.toLowerCase();
    const list = messages
      .filter((m) => !to || m.to.some((addr) => addr.toLowerCase() === to))
      .map(({ attachments, ...m }) => ({ ...m, attachments: attachments.map(({ content: _c, ...meta }) => meta) }))
      .reverse();
    return send(200, list);
  }
  const attachment = url.pathname.match(/^\/messages\/([\w-]+)\/attachments\/(\d+)$/);
  if (req.method === 'GET' && attachment) {
    const file = messages.find((m) => m.id === attachment[1])?.attachments[Number(attachment[2])];
    if (!file) return send(404, { error: 'not found' });
    res.writeHead(200, { 'content-type': file.contentType, 'content-disposition': `attachment; filename="${file.filename}"` });
    return res.end(file.content);
  }
  if (req.method === 'DELETE' && url.pathname === '/messages') {
    messages.length = 0;
    return send(200, { ok: true });
  }
  if (req.method === 'POST' && (url.pathname === '/control/down' || url.pathname === '/control/up')) {
    isDown = url.pathname.endsWith('down');
    return send(200, { down: isDown });
  }
  if (req.method === 'GET' && url.pathname === '/health') return send(200, { ok: true, down: isDown, count: messages.length });
  send(404, { error: 'not found' });
});

// A client that drops its connection mid-conversation (a process ending while it sends) is the
// client's problem: log it and keep serving, as a real mail server would.
smtp.on('error', (error: NodeJS.ErrnoException) => {
  console.warn(`[fake-smtp] connection error ignored: ${error.code ?? error.message}`);
});

smtp.listen(smtpPort, '127.0.0.1', () => {
  api.listen(apiPort, '127.0.0.1', () => {
    console.log(`[fake-smtp] SMTP on 127.0.0.1:${smtpPort}, inbox API on http://127.0.0.1:${apiPort}`);
  });
});

const shutdown = () => {
  api.close();
  smtp.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
