// Local stand-in for S3-compatible object storage, on 127.0.0.1:FAKE_S3_PORT, path-style (/bucket/key).
// It checks AWS Signature Version 4 the way the real service does, for header-signed requests (the app's SDK)
// and presigned URLs (the browser): a wrong signature is 403 SignatureDoesNotMatch, a presigned URL past
// X-Amz-Date + X-Amz-Expires is 403 AccessDenied "Request has expired", and every signed header (a presigned
// PUT's Content-Type and Content-Length) must be sent as signed. Objects live on disk under FAKE_S3_DATA_DIR
// (.data/s3-<state>/), so they survive a restart. POST /_fake/down and /_fake/up switch it "down" for tests
// (every storage request then answers 503), like the SMTP fake's switch; POST /_fake/hang makes it accept every
// storage request and never answer (a stalled storage) until /_fake/up; POST /_fake/down-after/<n> lets n more
// object writes through and then goes down (a storage that fails half-way through a long job).
// Supported: CreateBucket, HeadBucket, PutObject, CopyObject (x-amz-copy-source, x-amz-copy-source-if-match,
// x-amz-metadata-directive), GetObject and HeadObject (Range, If-Match, response-* overrides), DeleteObject,
// ListObjectsV2 (prefix, continuation, max-keys, start-after); CORS for the app's origin.
import http from 'node:http';
import fs from 'node:fs';
import path from 'node:path';
import { createHash, createHmac, randomUUID, timingSafeEqual } from 'node:crypto';

const port = Number(process.env.FAKE_S3_PORT ?? 12121);
const dataDir = path.resolve(process.env.FAKE_S3_DATA_DIR ?? path.join(process.cwd(), '.data', 's3-development'));
const accessKeyId = process.env.S3_ACCESS_KEY_ID || 'tidewarden-local';
const secretAccessKey = process.env.S3_SECRET_ACCESS_KEY || 'tidewarden-local-secret';
const region = process.env.S3_REGION || 'us-east-1';
const initialBucket = process.env.S3_BUCKET || 'tidewarden-local';
// Origins whose pages may PUT and GET directly (the bucket's CORS rule): the app's.
const allowedOrigins = new Set((process.env.FAKE_S3_CORS_ORIGINS ?? process.env.APP_URL ?? '').split(',').map((o) => o.trim()).filter(Boolean).map((o) => new URL(o).origin));
const MAX_OBJECT_BYTES = 64 * 1024 * 1024;
const MAX_CLOCK_SKEW_MS = 15 * 60 * 1000;
let isDown = false;
// "hang": every storage request is accepted and never answered (a storage that stalls), until /_fake/up.
let isHanging = false;
// Go down after this many more object writes (a storage that fails half-way through a long job); null: never.
let writesUntilDown: number | null = null;
const hangingRequests = new Set<http.ServerResponse>();

interface ObjectMeta {
  key: string;
  size: number;
  contentType: string;
  etag: string;
  lastModified: string;
}

// ---- storage on disk: <dataDir>/<bucket>/<sha256(key)>.bin + .json (metadata with the key) ----

const bucketDir = (bucket: string) => path.join(dataDir, bucket);
const objectBase = (bucket: string, key: string) => path.join(bucketDir(bucket), createHash('sha256').update(key).digest('hex'));
const bucketExists = (bucket: string) => fs.existsSync(bucketDir(bucket));

function readMeta(bucket: string, key: string): ObjectMeta | null {
  try {
    return JSON.parse(fs.readFileSync(`${objectBase(bucket, key)}.json`, 'utf8')) as ObjectMeta;
  } catch {
    return null;
  }
}

/** Bytes first, then the metadata, each through a rename: a crash leaves either the old object or the new. */
function writeObject(bucket: string, key: string, body: Buffer, contentType: string): ObjectMeta {
  const base = objectBase(bucket, key);
  const meta: ObjectMeta = { key, size: body.length, contentType, etag: `"${createHash('md5').update(body).digest('hex')}"`, lastModified: new Date().toISOString() };
  const tmp = `${base}.${randomUUID()}.tmp`;
  fs.writeFileSync(tmp, body);
  fs.renameSync(tmp, `${base}.bin`);
  fs.writeFileSync(`${tmp}.json`, JSON.stringify(meta));
  fs.renameSync(`${tmp}.json`, `${base}.json`);
  return meta;
}

function deleteObject(bucket: string, key: string) {
  const base = objectBase(bucket, key);
  fs.rmSync(`${base}.json`, { force: true });
  fs.rmSync(`${base}.bin`, { force: true });
}

function listBucket(bucket: string): ObjectMeta[] {
  const out: ObjectMeta[] = [];
  for (const name of fs.readdirSync(bucketDir(bucket))) {
    if (!name.endsWith('.json') || name.includes('.tmp')) continue;
    try {
      out.push(JSON.parse(fs.readFileSync(path.join(bucketDir(bucket), name), 'utf8')) as ObjectMeta);
    } catch {
      // a half-written metadata file of a crashed write: not an object
    }
  }
  return out.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
}

// ---- responses ----

const xmlEscape = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');

function corsHeaders(req: http.IncomingMessage): Record<string, string> {
  const origin = req.headers.origin;
  if (!origin || !allowedOrigins.has(origin)) return {};
  return { 'access-control-allow-origin': origin, 'access-control-expose-headers': 'ETag, Content-Length, Content-Type', vary: 'Origin' };
}

function sendError(req: http.IncomingMessage, res: http.ServerResponse, status: number, code: string, message: string, resource = '') {
  const body = `<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${code}</Code><Message>${xmlEscape(message)}</Message><Resource>${xmlEscape(resource)}</Resource><RequestId>${randomUUID()}</RequestId></Error>`;
  res.writeHead(status, { 'content-type': 'application/xml', 'content-length': Buffer.byteLength(body), ...corsHeaders(req) });
  res.end(req.method === 'HEAD' ? undefined : body);
}

function sendXml(req: http.IncomingMessage, res: http.ServerResponse, status: number, body: string) {
  const xml = `<?xml version="1.0" encoding="UTF-8"?>\n${body}`;
  res.writeHead(status, { 'content-type': 'application/xml', 'content-length': Buffer.byteLength(xml), ...corsHeaders(req) });
  res.end(xml);
}

class S3Failure extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

// ---- Signature Version 4 ----

/** RFC 3986 encoding as SigV4 asks for in the canonical query string. */
const uriEncode = (s: string) => encodeURIComponent(s).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
const sha256Hex = (data: string | Buffer) => createHash('sha256').update(data).digest('hex');
const hmac = (key: Buffer | string, data: string) => createHmac('sha256', key).update(data).digest();

function signingKey(date: string, signingRegion: string, service: string) {
  return hmac(hmac(hmac(hmac(`AWS4${secretAccessKey}`, date), signingRegion), service), 'aws4_request');
}

/** "20261202T101500Z" as a Date, or null. */
function parseAmzDate(value: string | null | undefined): Date | null {
  const m = value?.match(/^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/);
  if (!m) return null;
  return new Date(Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +m[6]));
}

/** The query as [name, value] pairs, decoded once, in the order sent. */
function queryPairs(rawQuery: string): [string, string][] {
  if (!rawQuery) return [];
  return rawQuery.split('&').filter(Boolean).map((part) => {
    const eq = part.indexOf('=');
    const decode = (s: string) => decodeURIComponent(s.replace(/\+/g, '%20'));
    return eq < 0 ? [decode(part), ''] : [decode(part.slice(0, eq)), decode(part.slice(eq + 1))];
  });
}

function canonicalQuery(pairs: [string, string][]): string {
  return pairs
    .map(([k, v]) => [uriEncode(k), uriEncode(v)] as const)
    .sort(([ak, av], [bk, bv]) => (ak < bk ? -1 : ak > bk ? 1 : av < bv ? -1 : av > bv ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join('&');
}

function headerValue(req: http.IncomingMessage, name: string): string | null {
  const v = req.headers[name];
  if (v === undefined) return null;
  return (Array.isArray(v) ? v.join(',') : v).trim().replace(/\s+/g, ' ');
}

interface SignedRequest {
  presigned: boolean;
  payloadHash: string;
}

/**
 * Verifies the request's signature; throws S3Failure (403) when it is missing, wrong or expired.
 * The canonical URI is the path as sent (S3 does not encode it twice).
 */
function verifySignature(req: http.IncomingMessage, rawPath: string, pairs: [string, string][]): SignedRequest {
  const query = new Map(pairs);
  const presigned = query.has('X-Amz-Signature');
  let credential: string;
  let signedHeaders: string[];
  let signature: string;
  let amzDate: string;
  let payloadHash: string;
  if (presigned) {
    if (query.get('X-Amz-Algorithm') !== 'AWS4-HMAC-SHA256') throw new S3Failure(400, 'AuthorizationQueryParametersError', 'X-Amz-Algorithm only supports "AWS4-HMAC-SHA256".');
    credential = query.get('X-Amz-Credential') ?? '';
    signedHeaders = (query.get('X-Amz-SignedHeaders') ?? '').split(';').filter(Boolean);
    signature = query.get('X-Amz-Signature') ?? '';
    amzDate = query.get('X-Amz-Date') ?? '';
    payloadHash = query.get('X-Amz-Content-Sha256') ?? 'UNSIGNED-PAYLOAD';
    const signedAt = parseAmzDate(amzDate);
    const expires = Number(query.get('X-Amz-Expires'));
    if (!signedAt || !Number.isInteger(expires) || expires < 1 || expires > 604800) throw new S3Failure(400, 'AuthorizationQueryParametersError', 'X-Amz-Date and X-Amz-Expires must be a valid date and a number of seconds up to 604800.');
    if (Date.now() > signedAt.getTime() + expires * 1000) throw new S3Failure(403, 'AccessDenied', 'Request has expired');
    if (signedAt.getTime() > Date.now() + MAX_CLOCK_SKEW_MS) throw new S3Failure(403, 'AccessDenied', 'Request is not valid yet');
  } else {
    const authorization = headerValue(req, 'authorization');
    if (!authorization) throw new S3Failure(403, 'AccessDenied', 'Access Denied');
    const m = authorization.match(/^AWS4-HMAC-SHA256 Credential=([^,]+),\s*SignedHeaders=([^,]+),\s*Signature=([0-9a-f]{64})$/);
    if (!m) throw new S3Failure(400, 'AuthorizationHeaderMalformed', 'The authorization header is malformed.');
    [, credential, , signature] = m;
    signedHeaders = m[2].split(';');
    amzDate = headerValue(req, 'x-amz-date') ?? '';
    payloadHash = headerValue(req, 'x-amz-content-sha256') ?? '';
    const signedAt = parseAmzDate(amzDate);
    if (!signedAt) throw new S3Failure(403, 'AccessDenied', 'AWS authentication requires a valid Date or x-amz-date header');
    if (Math.abs(Date.now() - signedAt.getTime()) > MAX_CLOCK_SKEW_MS) throw new S3Failure(403, 'RequestTimeTooSkewed', 'The difference between the request time and the current time is too large.');
    if (!payloadHash) throw new S3Failure(400, 'InvalidRequest', 'Missing required header for this request: x-amz-content-sha256');
    if (payloadHash.startsWith('STREAMING-')) throw new S3Failure(501, 'NotImplemented', 'This storage fake does not accept aws-chunked uploads.');
  }
  const [keyId, date, credRegion, service, terminator] = credential.split('/');
  if (keyId !== accessKeyId) throw new S3Failure(403, 'InvalidAccessKeyId', 'The AWS Access Key Id you provided does not exist in our records.');
  if (!date || credRegion !== region || service !== 's3' || terminator !== 'aws4_request' || !amzDate.startsWith(date)) {
    throw new S3Failure(400, 'AuthorizationHeaderMalformed', `The credential scope is wrong; expecting "<date>/${region}/s3/aws4_request".`);
  }
  if (!signedHeaders.includes('host')) throw new S3Failure(403, 'AccessDenied', 'The host header must be signed.');
  const canonicalHeaders = signedHeaders
    .map((name) => {
      const value = headerValue(req, name);
      // A signed header the request does not carry cannot match its signature.
      if (value === null) throw new S3Failure(403, 'SignatureDoesNotMatch', `The request signature we calculated does not match the signature you provided (signed header ${name} is missing).`);
      return `${name}:${value}\n`;
    })
    .join('');
  const canonicalRequest = [req.method, rawPath, canonicalQuery(pairs.filter(([k]) => !(presigned && k === 'X-Amz-Signature'))), canonicalHeaders, signedHeaders.join(';'), payloadHash].join('\n');
  const scope = `${date}/${credRegion}/${service}/aws4_request`;
  const stringToSign = ['AWS4-HMAC-SHA256', amzDate, scope, sha256Hex(canonicalRequest)].join('\n');
  const expected = hmac(signingKey(date, credRegion, service), stringToSign);
  const given = Buffer.from(signature, 'hex');
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) {
    throw new S3Failure(403, 'SignatureDoesNotMatch', 'The request signature we calculated does not match the signature you provided. Check your key and signing method.');
  }
  return { presigned, payloadHash };
}

// ---- request handling ----

function readBody(req: http.IncomingMessage): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on('data', (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_OBJECT_BYTES) {
        reject(new S3Failure(400, 'EntityTooLarge', 'Your proposed upload exceeds the maximum allowed object size.'));
        req.destroy();
        return;
      }
      chunks.push(chunk);
    });
    req.on('end', () => resolve(Buffer.concat(chunks)));
    req.on('error', reject);
  });
}

function parseRange(header: string | null, size: number): { start: number; end: number } | null | 'invalid' {
  if (!header) return null;
  const m = header.match(/^bytes=(\d*)-(\d*)$/);
  if (!m || (m[1] === '' && m[2] === '')) return 'invalid';
  let start: number;
  let end: number;
  if (m[1] === '') {
    start = Math.max(0, size - Number(m[2]));
    end = size - 1;
  } else {
    start = Number(m[1]);
    end = m[2] === '' ? size - 1 : Math.min(Number(m[2]), size - 1);
  }
  if (start >= size || start > end) return 'invalid';
  return { start, end };
}

/** If-Match: "*" or a list of ETags (quoted or not). */
function etagMatches(header: string, etag: string): boolean {
  const bare = (t: string) => t.trim().replace(/^W\//, '').replace(/^"|"$/g, '');
  return header.split(',').some((t) => t.trim() === '*' || bare(t) === bare(etag));
}

async function handle(req: http.IncomingMessage, res: http.ServerResponse) {
  const rawUrl = req.url ?? '/';
  const qIndex = rawUrl.indexOf('?');
  const rawPath = qIndex < 0 ? rawUrl : rawUrl.slice(0, qIndex);
  const rawQuery = qIndex < 0 ? '' : rawUrl.slice(qIndex + 1);

  // Test-only controls, outside any bucket (a bucket name cannot contain "_").
  if (rawPath.startsWith('/_fake/')) {
    if (req.method === 'POST' && (rawPath === '/_fake/down' || rawPath === '/_fake/up' || rawPath === '/_fake/hang')) {
      isDown = rawPath.endsWith('down');
      isHanging = rawPath.endsWith('hang');
      writesUntilDown = null;
      if (!isHanging) {
        // The stalled requests end now (their callers gave up long ago or are about to).
        for (const stalled of hangingRequests) stalled.destroy();
        hangingRequests.clear();
      }
      res.writeHead(200, { 'content-type': 'application/json' });
      return res.end(JSON.stringify({ down: isDown, hanging: isHanging }));
    }
    const downAfter = /^\/_fake\/down-after\/(\d+)$/.exec(rawPath);
    if (req.method === 'POST' && downAfter) {
      isDown = false;
      isHanging = false;
      writesUntilDown = Number(downAfter[1]);
      res.writeHead(200, { 'content-type': 'application/json' });
      return res.end(JSON.stringify({ writesUntilDown }));
    }
    if (req.method === 'GET' && rawPath === '/_fake/health') {
      res.writeHead(200, { 'content-type': 'application/json' });
      return res.end(JSON.stringify({ ok: true, down: isDown }));
    }
    res.writeHead(404, { 'content-type': 'application/json' });
    return res.end(JSON.stringify({ error: 'not found' }));
  }

  // The bucket's CORS rule: the app's pages may PUT and GET; the preflight is not signed.
  if (req.method === 'OPTIONS') {
    const origin = req.headers.origin;
    if (!origin || !allowedOrigins.has(origin)) return sendError(req, res, 403, 'AccessForbidden', 'CORSResponse: This CORS request is not allowed.');
    res.writeHead(200, {
      'access-control-allow-origin': origin,
      'access-control-allow-methods': 'GET, PUT, HEAD',
      'access-control-allow-headers': 'content-type',
      'access-control-max-age': '600',
      vary: 'Origin',
    });
    return res.end();
  }

  if (isHanging) {
    req.resume();
    hangingRequests.add(res);
    res.on('close', () => hangingRequests.delete(res));
    return;
  }
  if (isDown) return sendError(req, res, 503, 'ServiceUnavailable', 'Service is unable to handle request (the fake is switched down).');

  const segments = rawPath.split('/');
  const bucket = decodeURIComponent(segments[1] ?? '');
  const key = segments.slice(2).map((s) => decodeURIComponent(s)).join('/');
  const pairs = queryPairs(rawQuery);
  const query = new Map(pairs);

  let signed: SignedRequest;
  try {
    signed = verifySignature(req, rawPath, pairs);
  } catch (error) {
    if (error instanceof S3Failure) {
      req.resume();
      return sendError(req, res, error.status, error.code, error.message, rawPath);
    }
    throw error;
  }
  if (!bucket) return sendError(req, res, 400, 'InvalidRequest', 'This fake serves path-style requests to one bucket at a time (/bucket/key).');

  // ---- bucket operations ----
  if (!key) {
    if (req.method === 'PUT') {
      if (!/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/.test(bucket)) return sendError(req, res, 400, 'InvalidBucketName', 'The specified bucket is not valid.', bucket);
      await readBody(req);
      if (bucketExists(bucket)) return sendError(req, res, 409, 'BucketAlreadyOwnedByYou', 'Your previous request to create the named bucket succeeded and you already own it.', bucket);
      fs.mkdirSync(bucketDir(bucket), { recursive: true });
      res.writeHead(200, { location: `/${bucket}`, ...corsHeaders(req) });
      return res.end();
    }
    if (!bucketExists(bucket)) return sendError(req, res, 404, 'NoSuchBucket', 'The specified bucket does not exist', bucket);
    if (req.method === 'HEAD') {
      res.writeHead(200, { 'x-amz-bucket-region': region });
      return res.end();
    }
    if (req.method === 'GET' && query.get('list-type') === '2') return listObjectsV2(req, res, bucket, query);
    return sendError(req, res, 501, 'NotImplemented', 'A header or query you provided implies functionality that is not implemented.', bucket);
  }

  if (!bucketExists(bucket)) {
    req.resume();
    return sendError(req, res, 404, 'NoSuchBucket', 'The specified bucket does not exist', bucket);
  }
  if (Buffer.byteLength(key) > 1024) return sendError(req, res, 400, 'KeyTooLongError', 'Your key is too long');

  // ---- object operations ----
  if (req.method === 'PUT' && writesUntilDown !== null) {
    if (writesUntilDown <= 0) {
      isDown = true;
      writesUntilDown = null;
      req.resume();
      return sendError(req, res, 503, 'ServiceUnavailable', 'Service is unable to handle request (the fake went down after its writes).');
    }
    writesUntilDown--;
  }
  if (req.method === 'PUT' && req.headers['x-amz-copy-source']) {
    // CopyObject: x-amz-copy-source is "<bucket>/<key>" (URL-encoded, optionally with a leading "/"), within this fake.
    await readBody(req);
    const source = decodeURIComponent(String(req.headers['x-amz-copy-source']).replace(/^\//, '').split('?')[0]!);
    const slash = source.indexOf('/');
    const sourceBucket = source.slice(0, slash);
    const sourceKey = source.slice(slash + 1);
    if (slash < 1 || !bucketExists(sourceBucket)) return sendError(req, res, 404, 'NoSuchBucket', 'The specified bucket does not exist', sourceBucket);
    const sourceMeta = readMeta(sourceBucket, sourceKey);
    if (!sourceMeta) return sendError(req, res, 404, 'NoSuchKey', 'The specified key does not exist.', sourceKey);
    const ifMatch = headerValue(req, 'x-amz-copy-source-if-match');
    if (ifMatch && !etagMatches(ifMatch, sourceMeta.etag)) return sendError(req, res, 412, 'PreconditionFailed', 'At least one of the pre-conditions you specified did not hold', 'x-amz-copy-source-If-Match');
    const bytes = fs.readFileSync(`${objectBase(sourceBucket, sourceKey)}.bin`);
    const replace = headerValue(req, 'x-amz-metadata-directive') === 'REPLACE';
    const meta = writeObject(bucket, key, bytes, replace ? (headerValue(req, 'content-type') ?? 'binary/octet-stream') : sourceMeta.contentType);
    return sendXml(req, res, 200, `<?xml version="1.0" encoding="UTF-8"?><CopyObjectResult><LastModified>${meta.lastModified}</LastModified><ETag>${xmlEscape(meta.etag)}</ETag></CopyObjectResult>`);
  }
  if (req.method === 'PUT') {
    const body = await readBody(req);
    const declared = req.headers['content-length'];
    if (declared === undefined) return sendError(req, res, 411, 'MissingContentLength', 'You must provide the Content-Length HTTP header.');
    if (Number(declared) !== body.length) return sendError(req, res, 400, 'IncompleteBody', 'You did not provide the number of bytes specified by the Content-Length HTTP header.');
    if (!signed.presigned && signed.payloadHash !== 'UNSIGNED-PAYLOAD' && signed.payloadHash !== sha256Hex(body)) {
      return sendError(req, res, 400, 'XAmzContentSHA256Mismatch', 'The provided x-amz-content-sha256 header does not match what was computed.');
    }
    const meta = writeObject(bucket, key, body, headerValue(req, 'content-type') ?? 'binary/octet-stream');
    res.writeHead(200, { etag: meta.etag, ...corsHeaders(req) });
    return res.end();
  }
  if (req.method === 'GET' || req.method === 'HEAD') {
    const meta = readMeta(bucket, key);
    if (!meta) return sendError(req, res, 404, 'NoSuchKey', 'The specified key does not exist.', key);
    const ifMatch = headerValue(req, 'if-match');
    if (ifMatch && !etagMatches(ifMatch, meta.etag)) return sendError(req, res, 412, 'PreconditionFailed', 'At least one of the pre-conditions you specified did not hold', 'If-Match');
    const range = parseRange(headerValue(req, 'range'), meta.size);
    if (range === 'invalid') return sendError(req, res, 416, 'InvalidRange', 'The requested range is not satisfiable');
    const headers: Record<string, string | number> = {
      'content-type': query.get('response-content-type') ?? meta.contentType,
      etag: meta.etag,
      'last-modified': new Date(meta.lastModified).toUTCString(),
      'accept-ranges': 'bytes',
      ...corsHeaders(req),
    };
    for (const [param, header] of [['response-content-disposition', 'content-disposition'], ['response-cache-control', 'cache-control'], ['response-content-language', 'content-language'], ['response-expires', 'expires']] as const) {
      const v = query.get(param);
      if (v) headers[header] = v;
    }
    const file = `${objectBase(bucket, key)}.bin`;
    if (range) {
      headers['content-range'] = `bytes ${range.start}-${range.end}/${meta.size}`;
      headers['content-length'] = range.end - range.start + 1;
      res.writeHead(206, headers);
      if (req.method === 'HEAD') return res.end();
      return fs.createReadStream(file, { start: range.start, end: range.end }).pipe(res);
    }
    headers['content-length'] = meta.size;
    res.writeHead(200, headers);
    if (req.method === 'HEAD') return res.end();
    return fs.createReadStream(file).pipe(res);
  }
  if (req.method === 'DELETE') {
    deleteObject(bucket, key);
    res.writeHead(204, corsHeaders(req));
    return res.end();
  }
  return sendError(req, res, 405, 'MethodNotAllowed', 'The specified method is not allowed against this resource.');
}

function listObjectsV2(req: http.IncomingMessage, res: http.ServerResponse, bucket: string, query: Map<string, string>) {
  const prefix = query.get('prefix') ?? '';
  const maxKeys = Math.max(0, Math.min(1000, Number(query.get('max-keys') ?? 1000) || 1000));
  const token = query.get('continuation-token');
  const startAfter = token ? Buffer.from(token, 'base64url').toString('utf8') : (query.get('start-after') ?? '');
  const all = listBucket(bucket).filter((o) => o.key.startsWith(prefix) && o.key > startAfter);
  const page = all.slice(0, maxKeys);
  const truncated = all.length > page.length;
  const contents = page
    .map((o) => `<Contents><Key>${xmlEscape(o.key)}</Key><LastModified>${o.lastModified}</LastModified><ETag>${xmlEscape(o.etag)}</ETag><Size>${o.size}</Size><StorageClass>STANDARD</StorageClass></Contents>`)
    .join('');
  const next = truncated ? `<NextContinuationToken>${Buffer.from(page[page.length - 1].key, 'utf8').toString('base64url')}</NextContinuationToken>` : '';
  sendXml(
    req,
    res,
    200,
    `<ListBucketResult xmlns="http://s3.amazonaws.com/doc/2006-03-01/"><Name>${xmlEscape(bucket)}</Name><Prefix>${xmlEscape(prefix)}</Prefix><KeyCount>${page.length}</KeyCount><MaxKeys>${maxKeys}</MaxKeys><IsTruncated>${truncated}</IsTruncated>${token ? `<ContinuationToken>${xmlEscape(token)}</ContinuationToken>` : ''}${next}${contents}</ListBucketResult>`,
  );
}

fs.mkdirSync(bucketDir(initialBucket), { recursive: true });

const server = http.createServer((req, res) => {
  handle(req, res).catch((error: unknown) => {
    if (error instanceof S3Failure) return sendError(req, res, error.status, error.code, error.message);
    console.error('[fake-s3] request failed:', error);
    if (!res.headersSent) sendError(req, res, 500, 'InternalError', 'We encountered an internal error. Please try again.');
    else res.destroy();
  });
});

server.listen(port, '127.0.0.1', () => {
  console.log(`[fake-s3] object storage on http://127.0.0.1:${port} (bucket ${initialBucket}, data in ${dataDir})`);
});

const shutdown = () => {
  server.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 1000).unref();
};
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
