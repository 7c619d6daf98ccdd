/** The storage could not be reached or answered with an error of its own; nothing about the file is known. */
export class StorageUnavailableError extends Error {
  constructor(
    readonly operation: string,
    cause?: unknown,
  ) {
    super(`The file storage did not answer the ${operation}.`, { cause });
    this.name = 'StorageUnavailableError';
  }
}

/** What a user reads when the storage is down: true whatever the operation, since the caller rolls back. */
export const STORAGE_UNAVAILABLE_MESSAGE = 'The file storage cannot be reached just now; nothing was recorded. Try again in a few minutes.';

/** The storage refused the app itself (wrong keys, no such bucket, no permission): an administrator must act. */
export class StorageMisconfiguredError extends Error {
  constructor(
    readonly operation: string,
    cause?: unknown,
  ) {
    super(`The file storage refused the ${operation}: the storage settings (S3_*) are wrong.`, { cause });
    this.name = 'StorageMisconfiguredError';
  }
}

/** What a user reads when the storage refuses the app's own settings: retrying will not help. */
export const STORAGE_MISCONFIGURED_MESSAGE = 'The file storage is misconfigured; nothing was recorded. Tell your administrator.';
