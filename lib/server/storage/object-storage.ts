// The object storage (S3-compatible) that keeps survey photos and reports. One client per process; every
// call that reaches the storage turns a network failure or a storage-side error into StorageUnavailableError,
// which the error mapper answers 503 with a sentence that says nothing was recorded.
import {
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
import { StorageUnavailableError } from './storage-error';

export { StorageUnavailableError };

export interface ObjectHead {
  sizeBytes: number;
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
      throw new StorageUnavailableError(operation, error);
    }
  }

  async putObject(key: string, bytes: Uint8Array, contentType: string): Promise<void> {
    await this.call('upload', () => this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.length })));
  }

  /** The object's size and type, or null when there is no such object. */
  async headObject(key: string): Promise<ObjectHead | null> {
    try {
      const head = await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: key }));
      return { sizeBytes: Number(head.ContentLength ?? 0), contentType: head.ContentType ?? null, lastModified: head.LastModified ?? null };
    } catch (error) {
      if (isMissing(error)) return null;
      throw new StorageUnavailableError('check of a file', error);
    }
  }

  /** The first `count` bytes of an object (fewer if it is shorter), or null when there is no such object. */
  async readFirstBytes(key: string, count: number): Promise<Uint8Array | null> {
    try {
      const got = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key, Range: `bytes=0-${count - 1}` }));
      return got.Body ? await got.Body.transformToByteArray() : new Uint8Array();
    } catch (error) {
      if (isMissing(error)) return null;
      throw new StorageUnavailableError('read of a file', error);
    }
  }

  /** The whole object, or null when there is no such object. */
  async getObject(key: string): Promise<Uint8Array | null> {
    try {
      const got = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return got.Body ? await got.Body.transformToByteArray() : new Uint8Array();
    } catch (error) {
      if (isMissing(error)) return null;
      throw new StorageUnavailableError('read of a file', error);
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

  /** Creates the bucket when it is missing (the local fake creates its own; a fresh store may not have one). */
  async ensureBucket(): Promise<void> {
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.bucket }));
    } catch (error) {
      if (!isMissing(error)) throw new StorageUnavailableError('check of the bucket', error);
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

function isMissing(error: unknown): boolean {
  if (!(error instanceof S3ServiceException)) return false;
  return error.$metadata?.httpStatusCode === 404 || error.name === 'NotFound' || error.name === 'NoSuchKey' || error.name === 'NoSuchBucket';
}

const globalForStorage = globalThis as unknown as { tidewardenStorage?: ObjectStorage };

/** The storage named by the environment (S3_*), created once per process. */
export function getStorage(): ObjectStorage {
  return (globalForStorage.tidewardenStorage ??= new ObjectStorage(getEnv()));
}
