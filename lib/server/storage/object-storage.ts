// The object storage (S3-compatible) that keeps survey photos and reports. One client per process; every
// call that reaches the storage turns a network failure, a timeout or a storage-side error into
// StorageUnavailableError (503, nothing recorded, try again), except the answers that mean the app's own settings
// are wrong (StorageMisconfiguredError, 500: retrying will not help, an administrator must act).
// Every call is bounded in time: a storage that accepts the connection and never answers must not hold a
// request (and its database connection) for ever.
import {
  CopyObjectCommand,
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { getEnv, type Env } from '../env';
import { StorageMisconfiguredError, StorageUnavailableError } from './storage-error';

export { StorageMisconfiguredError, StorageUnavailableError };

/** How long the connection to the storage may take to open. */
export const STORAGE_CONNECT_TIMEOUT_MS = 2_000;
/** How long one request to the storage may take in all (HEAD, a ranged read, a server-side copy, a delete). */
export const STORAGE_REQUEST_TIMEOUT_MS = 10_000;
/** How long the server-side upload of a whole file (up to 10 MB, the multipart route and the mover) may take. */
export const STORAGE_UPLOAD_TIMEOUT_MS = 60_000;

export interface ObjectHead {
  sizeBytes: number;
  /** The storage's version tag of these bytes; a conditional read or copy with it fails if the object changed. */
  etag: string | null;
  contentType: string | null;
  lastModified: Date | null;
}

export interface ListedObject {
  key: string;
  sizeBytes: number;
  lastModified: Date;
}

type StorageSettings = Pick<Env, 'S3_ENDPOINT' | 'S3_BUCKET' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY' | 'S3_REGION' | 'S3_FORCE_PATH_STYLE'>;

export class ObjectStorage {
  readonly client: S3Client;
  readonly bucket: string;
  readonly endpoint: string;

  constructor(settings: StorageSettings) {
    this.bucket = settings.S3_BUCKET;
    this.endpoint = settings.S3_ENDPOINT;
    this.client = new S3Client({
      endpoint: settings.S3_ENDPOINT,
      region: settings.S3_REGION,
      forcePathStyle: settings.S3_FORCE_PATH_STYLE,
      credentials: { accessKeyId: settings.S3_ACCESS_KEY_ID, secretAccessKey: settings.S3_SECRET_ACCESS_KEY },
      // One quick retry: a user waits on these calls, and the caller answers "try again later" anyway.
      maxAttempts: 2,
      // Bounded: a hanging storage becomes a TimeoutError (then a 503) instead of a request that never ends.
      requestHandler: { connectionTimeout: STORAGE_CONNECT_TIMEOUT_MS, requestTimeout: STORAGE_REQUEST_TIMEOUT_MS, throwOnRequestTimeout: true },
      // Checksums only where the API requires them: a presigned PUT from a browser cannot add a trailer.
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    });
  }

  /** The storage's origin (scheme, host, port), for the Content-Security-Policy of pages that show or upload files. */
  get origin(): string {
    return new URL(this.endpoint).origin;
  }

  private async call<T>(operation: string, run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (error) {
      throw storageFailure(operation, error);
    }
  }

  async putObject(key: string, bytes: Uint8Array, contentType: string): Promise<void> {
    await this.call('upload', () =>
      this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.length }), { requestTimeout: STORAGE_UPLOAD_TIMEOUT_MS }),
    );
  }

  /** The object's size and type, or null when there is no such object. */
  async headObject(key: string): Promise<ObjectHead | null> {
    try {
      const head = await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: key }));
      return { sizeBytes: Number(head.ContentLength ?? 0), etag: head.ETag ?? null, contentType: head.ContentType ?? null, lastModified: head.LastModified ?? null };
    } catch (error) {
      if (isMissingKey(error)) {
        // A HEAD answer has no body: a missing object and a missing bucket both read 404. Tell them apart.
        await this.throwIfBucketMissing('check of a file');
        return null;
      }
      throw storageFailure('check of a file', error);
    }
  }

  /**
   * The first `count` bytes of an object (fewer if it is shorter), or null when there is no such object. With
   * `ifMatch` (an ETag from headObject), 'changed' when the object is no longer those bytes.
   */
  async readFirstBytes(key: string, count: number, ifMatch?: string): Promise<Uint8Array | null | 'changed'> {
    try {
      const got = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key, Range: `bytes=0-${count - 1}`, IfMatch: ifMatch }));
      return got.Body ? await got.Body.transformToByteArray() : new Uint8Array();
    } catch (error) {
      if (isMissingKey(error)) return null;
      if (isPreconditionFailed(error)) return 'changed';
      throw storageFailure('read of a file', error);
    }
  }

  /**
   * Server-side copy of `from` to `to`, only if `from` is still the bytes tagged `ifMatch`; 'changed' when it is
   * not (or is gone). The copy is what gets recorded: no client ever has a link that writes to `to`.
   */
  async copyObject(from: string, to: string, ifMatch: string): Promise<'copied' | 'changed'> {
    try {
      await this.client.send(
        new CopyObjectCommand({ Bucket: this.bucket, Key: to, CopySource: `${this.bucket}/${from.split('/').map(encodeURIComponent).join('/')}`, CopySourceIfMatch: ifMatch }),
      );
      return 'copied';
    } catch (error) {
      if (isPreconditionFailed(error) || isMissingKey(error)) return 'changed';
      throw storageFailure('copy of a file', error);
    }
  }

  /** The whole object, or null when there is no such object. */
  async getObject(key: string): Promise<Uint8Array | null> {
    try {
      const got = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return got.Body ? await got.Body.transformToByteArray() : new Uint8Array();
    } catch (error) {
      if (isMissingKey(error)) return null;
      throw storageFailure('read of a file', error);
    }
  }

  /** Deletes an object; deleting one that is already gone is not an error (S3 answers 204 either way). */
  async deleteObject(key: string): Promise<void> {
    await this.call('delete', () => this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key })));
  }

  /** One page of the objects under a prefix, in key order; pass the returned token to get the next page. */
  async listObjects(prefix: string, continuationToken?: string, pageSize = 1000): Promise<{ objects: ListedObject[]; nextToken: string | null }> {
    const page = await this.call('listing', () =>
      this.client.send(new ListObjectsV2Command({ Bucket: this.bucket, Prefix: prefix, ContinuationToken: continuationToken, MaxKeys: pageSize })),
    );
    return {
      objects: (page.Contents ?? []).map((o) => ({ key: o.Key ?? '', sizeBytes: Number(o.Size ?? 0), lastModified: o.LastModified ?? new Date(0) })).filter((o) => o.key),
      nextToken: page.IsTruncated ? (page.NextContinuationToken ?? null) : null,
    };
  }

  /** A StorageMisconfiguredError when the bucket itself is not there (the settings name a bucket that does not exist). */
  private async throwIfBucketMissing(operation: string): Promise<void> {
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }));
    } catch (error) {
      if (error instanceof S3ServiceException && (error.$metadata?.httpStatusCode === 404 || error.name === 'NoSuchBucket' || error.name === 'NotFound')) {
        throw new StorageMisconfiguredError(operation, error);
      }
      throw storageFailure(operation, error);
    }
  }

  /** Creates the bucket when it is missing (the local fake creates its own; a fresh store may not have one). */
  async ensureBucket(): Promise<void> {
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }));
    } catch (error) {
      if (!(error instanceof S3ServiceException && (error.$metadata?.httpStatusCode === 404 || error.name === 'NotFound' || error.name === 'NoSuchBucket'))) {
        throw storageFailure('check of the bucket', error);
      }
      await this.call('creation of the bucket', () => this.client.send(new CreateBucketCommand({ Bucket: this.bucket })));
    }
  }

  /**
   * A URL the browser PUTs the file to, valid for `expiresInSeconds`. Content-Type and Content-Length are
   * signed: a body of another type or length is refused by the storage.
   */
  async presignPut(key: string, contentType: string, sizeBytes: number, expiresInSeconds: number): Promise<string> {
    return getSignedUrl(this.client, new PutObjectCommand({ Bucket: this.bucket, Key: key, ContentType: contentType, ContentLength: sizeBytes }), {
      expiresIn: expiresInSeconds,
      signableHeaders: new Set(['content-type', 'content-length']),
    });
  }

  /** A URL that serves the object with the given type and disposition, valid for `expiresInSeconds`. */
  async presignGet(key: string, response: { contentType: string; contentDisposition: string }, expiresInSeconds: number): Promise<string> {
    return getSignedUrl(
      this.client,
      new GetObjectCommand({ Bucket: this.bucket, Key: key, ResponseContentType: response.contentType, ResponseContentDisposition: response.contentDisposition }),
      { expiresIn: expiresInSeconds },
    );
  }
}

/** The object is not there (the bucket is: a missing bucket is a misconfiguration, not a file that did not arrive). */
function isMissingKey(error: unknown): boolean {
  if (!(error instanceof S3ServiceException)) return false;
  if (error.name === 'NoSuchBucket') return false;
  return error.name === 'NotFound' || error.name === 'NoSuchKey' || (error.$metadata?.httpStatusCode === 404 && error.name !== 'NoSuchBucket');
}

function isPreconditionFailed(error: unknown): boolean {
  return error instanceof S3ServiceException && (error.name === 'PreconditionFailed' || error.$metadata?.httpStatusCode === 412);
}

/** Answers that mean the app's settings (keys, bucket, region) are wrong: retrying will not help. */
const CONFIGURATION_ERRORS = new Set(['AccessDenied', 'SignatureDoesNotMatch', 'InvalidAccessKeyId', 'NoSuchBucket', 'AuthorizationHeaderMalformed', 'PermanentRedirect', 'InvalidBucketName']);

/** A failed call as the error the mapper answers: misconfigured (500) or unavailable (503). */
export function storageFailure(operation: string, error: unknown): StorageUnavailableError | StorageMisconfiguredError {
  if (error instanceof S3ServiceException && CONFIGURATION_ERRORS.has(error.name)) return new StorageMisconfiguredError(operation, error);
  return new StorageUnavailableError(operation, error);
}

const globalForStorage = globalThis as unknown as { tidewardenStorage?: ObjectStorage };

/** The storage named by the environment (S3_*), created once per process. */
export function getStorage(): ObjectStorage {
  return (globalForStorage.tidewardenStorage ??= new ObjectStorage(getEnv()));
}
