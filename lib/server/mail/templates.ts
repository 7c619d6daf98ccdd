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

export function accountExistsMail(name: string, signInUrl: string, resetUrl: string) {
  return {
    subject: 'Someone tried to create a Tidewarden account with your address',
    ...render(
      [
        `Hello ${name},`,
        'Someone (perhaps you) tried to create a Tidewarden account with this e-mail address. You already have one, so nothing was changed and no second account exists.',
        `If it was you, sign in with your password; if you have forgotten it, choose a new one at ${resetUrl}. If it was not you, ignore this message.`,
      ],
      { url: signInUrl, label: 'Sign in' },
    ),
  };
}

export function noAccountMail(signUpUrl: string) {
  return {
    subject: 'Password reset for Tidewarden',
    ...render(
      [
        'Hello,',
        'Someone (perhaps you) asked to reset the Tidewarden password for this e-mail address, but no account uses it, so there is no password to reset.',
        'If it was you, you may have signed up with another address, or you can create an account. If it was not you, ignore this message.',
      ],
      { url: signUpUrl, label: 'Create an account' },
    ),
  };
}
