// Where an organisation's files live in the object storage. Every key starts with the organisation's prefix,
// so a key is checked against the organisation that asks for it before anything is read or recorded.
import { randomUUID } from 'node:crypto';

/** The prefix of everything one organisation stores. */
export const organisationPrefix = (organisationId: string) => `org/${organisationId}/`;

/** The key of a survey's photo or report: org/<organisation>/survey/<survey>/<uuid>. */
export const attachmentObjectKey = (organisationId: string, surveyId: string, id: string = randomUUID()) => `${organisationPrefix(organisationId)}survey/${surveyId}/${id}`;

/**
 * Where the browser sends one upload: org/<organisation>/upload/<pending upload>/<nonce>, new for every link
 * asked for. Only this key is ever in a PUT link; complete copies it (server-side) to a fresh attachment key,
 * so a link used again later writes to an object nothing names (the clean-up job removes it).
 */
export const stagingObjectKey = (organisationId: string, pendingUploadId: string, nonce: string = randomUUID()) => `${organisationPrefix(organisationId)}upload/${pendingUploadId}/${nonce}`;

/** True for a staging key of this organisation (see stagingObjectKey). */
export const isStagingKey = (key: string, organisationId: string) => isOrganisationKey(key, organisationId) && key.startsWith(`${organisationPrefix(organisationId)}upload/`);

/** Every key this app writes is under "org/"; the clean-up job lists only that. */
export const STORED_FILES_PREFIX = 'org/';

/** True when the key belongs to the organisation's own prefix and has no path tricks in it. */
export function isOrganisationKey(key: string, organisationId: string): boolean {
  return key.startsWith(organisationPrefix(organisationId)) && !key.split('/').some((part) => part === '' || part === '.' || part === '..');
}
