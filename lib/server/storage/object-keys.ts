// Where an organisation's files live in the object storage. Every key starts with the organisation's prefix,
// so a key is checked against the organisation that asks for it before anything is read or recorded.
import { randomUUID } from 'node:crypto';

/** The prefix of everything one organisation stores. */
export const organisationPrefix = (organisationId: string) => `org/${organisationId}/`;

/** The key of a survey's photo or report: org/<organisation>/survey/<survey>/<uuid>. */
export const attachmentObjectKey = (organisationId: string, surveyId: string, id: string = randomUUID()) => `${organisationPrefix(organisationId)}survey/${surveyId}/${id}`;

/** Every key this app writes is under "org/"; the clean-up job lists only that. */
export const STORED_FILES_PREFIX = 'org/';

/** True when the key belongs to the organisation's own prefix and has no path tricks in it. */
export function isOrganisationKey(key: string, organisationId: string): boolean {
  return key.startsWith(organisationPrefix(organisationId)) && !key.split('/').some((part) => part === '' || part === '.' || part === '..');
}
