// The text of every e-mail the app sends. Plain text first; a simple HTML twin for mail clients.
const escape = (s: string) => s.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);

function render(lines: string[], link?: { url: string; label: string }) {
  const text = [...lines, ...(link ? ['', `${link.label}: ${link.url}`] : []), '', '— Tidewarden'].join('\n');
  const html = `<div style="font-family:sans-serif;font-size:14px;color:#1c232b">${lines.map((l) => `<p>${escape(l)}</p>`).join('')}${
    link ? `<p><a href="${escape(link.url)}">${escape(link.label)}</a></p>` : ''
  }<p style="color:#7b8590">— Tidewarden</p></div>`;
  return { text, html };
}

export function verifyEmailMail(name: string, url: string) {
  return {
    subject: 'Confirm your e-mail address for Tidewarden',
    ...render([`Hello ${name},`, 'Please confirm your e-mail address to finish setting up your Tidewarden account. The link works once and expires in 24 hours.'], {
      url,
      label: 'Confirm my e-mail address',
    }),
  };
}

export function resetPasswordMail(name: string, url: string) {
  return {
    subject: 'Reset your Tidewarden password',
    ...render([`Hello ${name},`, 'Someone (we hope you) asked to reset your Tidewarden password. The link works once and expires in one hour. If it was not you, ignore this message; your password stays as it is.'], {
      url,
      label: 'Choose a new password',
    }),
  };
}

export function invitationMail(organisationName: string, inviterName: string, roleLabel: string, url: string) {
  return {
    subject: `${inviterName} invited you to ${organisationName} on Tidewarden`,
    ...render([`${inviterName} invited you to join ${organisationName} on Tidewarden as ${roleLabel.toLowerCase()}.`, 'The invitation works once and expires in 7 days.'], {
      url,
      label: 'Accept the invitation',
    }),
  };
}
