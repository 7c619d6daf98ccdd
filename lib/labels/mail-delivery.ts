/**
 * Where an e-mail we queued stands, in the words every screen uses. Safe for client code.
 * An e-mail is written to the outbox with the change that caused it and sent afterwards by the worker,
 * so "sent" is only said once the mail server has accepted it.
 */
export type MailDelivery = 'queued' | 'retrying' | 'sent' | 'not-delivered';

export const MAIL_DELIVERY_WORDS: Record<MailDelivery, string> = {
  queued: 'Queued, not sent yet',
  retrying: 'Not sent yet, retrying',
  sent: 'Sent',
  'not-delivered': 'Could not be sent',
};

/** From the outbox row's status and attempts. */
export function mailDelivery(status: 'pending' | 'sent' | 'failed', attempts: number): MailDelivery {
  if (status === 'sent') return 'sent';
  if (status === 'failed') return 'not-delivered';
  return attempts > 0 ? 'retrying' : 'queued';
}

/** The outbox key that ties an invitation to its e-mail. */
export const invitationMailKey = (invitationId: string) => `invitation:${invitationId}`;
