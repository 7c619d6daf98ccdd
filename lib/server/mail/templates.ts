// The text of every e-mail the app sends. Plain text first; a simple HTML twin for mail clients.
const escape = (s: string) => s.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);

function render(lines: string[], link?: { url: string; label: string }) {
  const text = [...lines, ...(link ? ['', `${link.label}: ${link.url}`] : []), '', '— Tidewarden'].join('\n');
  const html = `<div style="font-family:sans-serif;font-size:14px;color:#1c232b">${lines.map((l) => `<p>${escape(l)}</p>`).join('')}${
    link ? `<p><a href="${escape(link.url)}">${escape(link.label)}</a></p>` : ''
  }<p style="color:#5f6872">— Tidewarden</p></div>`;
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

/** One reading as the survey mails name it: where, as measured, and on the Ag/AgCl/seawater scale. */
export interface MailedReading {
  location: string;
  /** e.g. "+0.200 V against zinc (-0.850 V Ag/AgCl/seawater): protected" */
  value: string;
}

export function underProtectionMail(assetName: string, surveyLabel: string, readings: MailedReading[], url: string) {
  return {
    subject: `Under-protection found on ${assetName} (${surveyLabel})`,
    ...render(
      [
        `${readings.length} reading${readings.length === 1 ? ' is' : 's are'} less negative than the protection criterion in the ${surveyLabel} of ${assetName}:`,
        ...readings.map((r) => `• ${r.location}: ${r.value}`),
        'Check the anodes and their electrical continuity; verify against the governing standard before acting.',
        'Further under-protected readings in this survey are shown on its page; you are told again only if a reading named here is corrected.',
      ],
      { url, label: 'See the readings' },
    ),
  };
}

export function readingCorrectionMail(assetName: string, surveyLabel: string, correctedBy: string, corrections: { location: string; before: string; after: string | null }[], stillUnder: number | 'survey deleted', url: string) {
  return {
    subject: `Correction: readings of ${assetName} (${surveyLabel})`,
    ...render(
      [
        `${correctedBy} corrected ${corrections.length === 1 ? 'a reading' : `${corrections.length} readings`} of the ${surveyLabel} of ${assetName} that an earlier under-protection message named:`,
        ...corrections.map((c) => (c.after === null ? `• ${c.location}: ${c.before} — deleted` : `• ${c.location}: was ${c.before}; now ${c.after}`)),
        stillUnder === 'survey deleted'
          ? 'The whole survey was deleted; an engineer can restore it within 30 days.'
          : stillUnder ? `The survey now has ${stillUnder} under-protected reading${stillUnder === 1 ? '' : 's'}.` : 'The survey now has no under-protected reading.',
      ],
      { url, label: 'See the readings' },
    ),
  };
}
