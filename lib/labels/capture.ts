/**
 * Words for offline capture on the survey page (safe for client code, the service worker included): what
 * became of each queued item, and the sentences the capture route answers a refused item with.
 */

/** How the capture route answered one item. */
export const CAPTURE_RESULT_STATUSES = ['recorded', 'duplicate', 'conflict', 'invalid'] as const;
export type CaptureResultStatus = (typeof CAPTURE_RESULT_STATUSES)[number];

/** Where a queued item stands on the phone. */
export const CAPTURE_ITEM_STATES = ['waiting', 'sending', 'sent', 'conflict', 'invalid', 'failed'] as const;
export type CaptureItemState = (typeof CAPTURE_ITEM_STATES)[number];

export const CAPTURE_RESULT_LABELS: Readonly<Record<CaptureResultStatus, string>> = {
  recorded: 'Sent',
  duplicate: 'Sent (already recorded)',
  conflict: 'Not accepted',
  invalid: 'Needs a correction',
};

export const CAPTURE_ITEM_STATE_LABELS: Readonly<Record<CaptureItemState, string>> = {
  waiting: 'Saved on this phone, waiting to send',
  sending: 'Sending',
  sent: 'Sent',
  conflict: 'Not accepted: needs you',
  invalid: 'Needs a correction',
  failed: 'Upload refused',
};

export const CAPTURE_KIND_LABELS: Readonly<Record<'reading' | 'photo', string>> = { reading: 'Reading', photo: 'Photo' };

/** The sentences the capture route gives a refused item; the phone shows them beside the item. */
export const CAPTURE_CONFLICT_MESSAGES = {
  surveyGone: 'This survey no longer exists (it was deleted). An engineer can restore it from the bin; then send again, or discard the item.',
  assetArchived: 'The asset of this survey has been archived, so no readings can be added. Ask an engineer to restore it, or discard the item.',
  groupGone: 'That anode group is no longer fitted to this asset (closed or renewed). Choose another group, or none, and send again.',
  groupNotOnAsset: 'That anode group is not fitted to the asset of this survey. Choose one of its groups, or none, and send again.',
  notAllowed: 'Your role in this organisation no longer allows recording readings. Ask an owner, or discard the item.',
  otherMember: 'Captured by another member on this phone; sign in as them to send.',
  deletedSince: 'Received earlier and deleted on the desk since; not recorded again.',
} as const;

/** "Saved on this phone — 3 waiting to send", "Everything is sent": the count the status region reads out. */
export function captureQueueSummary(waiting: number, needsYou: number): string {
  const parts: string[] = [];
  if (waiting) parts.push(`Saved on this phone — ${waiting} waiting to send`);
  if (needsYou) parts.push(`${needsYou} need${needsYou === 1 ? 's' : ''} your attention`);
  return parts.length ? parts.join('; ') : 'Everything captured here is sent.';
}

/**
 * The line a page shows without signal (`offline`) or when what it shows is a copy the phone kept (the server did
 * not answer in time): how old what it shows is, in the phone's own time, and, where a capture form is on the
 * page, that capture still works.
 */
export function offlineCopyWords(since: Date, { offline, capturing }: { offline: boolean; capturing: boolean }): string {
  // Intl rather than date-fns: this runs on every organisation page, and the scripts of the first load are counted.
  const when = Number.isNaN(since.getTime()) ? 'at an unknown time' : 'on ' + new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23', day: 'numeric', month: 'short', year: 'numeric' }).format(since);
  const first = offline ? `No connection. This page shows what the server sent ${when}; it may have changed since.` : `The server did not answer in time. This page is the copy kept on this phone ${when}; it may have changed since.`;
  return capturing ? `${first} Readings and photos you capture are saved on this phone and sent when the connection returns.` : first;
}

/** The sign-out form's questions on a phone that keeps captured items (components/offline/sign-out-form.tsx). */
export const SIGN_OUT_WORDS = {
  unsent: (n: number) => `${n} captured item${n === 1 ? ' has' : 's have'} not been sent. Signing out deletes ${n === 1 ? 'it' : 'them'} from this phone.`,
  unknown: 'This phone could not check whether captured items still wait to be sent. Signing out deletes any that do.',
  offline: 'No connection: signing out needs the connection. Nothing was deleted and you are still signed in.',
  deleteAndSignOut: 'Delete and sign out',
  signOutAnyway: 'Sign out anyway',
  keep: 'Keep them and stay signed in',
  understood: 'Stay signed in',
} as const;
