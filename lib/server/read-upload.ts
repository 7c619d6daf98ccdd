import { AppError } from './errors';

/** A multipart body carries a little framing and the form's other fields besides the file. */
const MULTIPART_ALLOWANCE = 64 * 1024;

/**
 * The body as a stream that counts the bytes as they arrive and fails as soon as they pass `limit`:
 * the declared Content-Length is not trusted (a chunked upload has none), and nothing past the limit
 * is ever held in memory.
 */
function limited(body: ReadableStream<Uint8Array>, limit: number, state: { exceeded: boolean }): ReadableStream<Uint8Array> {
  const reader = body.getReader();
  let size = 0;
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      const { done, value } = await reader.read();
      if (done) {
        controller.close();
        return;
      }
      size += value.byteLength;
      if (size > limit) {
        state.exceeded = true;
        controller.error(new RangeError('The upload is larger than allowed.'));
        await reader.cancel().catch(() => undefined);
        return;
      }
      controller.enqueue(value);
    },
    cancel(reason) {
      return reader.cancel(reason);
    },
  });
}

async function readAll(stream: ReadableStream<Uint8Array>): Promise<Uint8Array> {
  const chunks: Uint8Array[] = [];
  let size = 0;
  const reader = stream.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
    size += value.byteLength;
  }
  const bytes = new Uint8Array(size);
  let offset = 0;
  for (const c of chunks) {
    bytes.set(c, offset);
    offset += c.byteLength;
  }
  return bytes;
}

/**
 * Reads an uploaded file (multipart field "file", or the raw body) without trusting the declared size:
 * a declared length over the limit is refused before reading, and reading stops at the limit whether
 * or not a length was declared, so memory never grows by more than the limit.
 */
export async function readUpload(req: Request, maxBytes: number): Promise<{ name: string; bytes: Uint8Array; fields: Record<string, string> }> {
  const tooLarge = () => new AppError('payload-too-large', `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB; nothing was imported.`);
  const type = req.headers.get('content-type') ?? '';
  const multipart = type.toLowerCase().startsWith('multipart/form-data');
  const limit = multipart ? maxBytes + MULTIPART_ALLOWANCE : maxBytes;
  const declared = Number(req.headers.get('content-length') ?? '0');
  if (declared > limit) throw tooLarge();
  if (!req.body) throw new AppError('invalid', multipart ? 'Choose a file to upload.' : 'The request has no file.', multipart ? { file: ['Choose a file to upload.'] } : {});
  const state = { exceeded: false };
  const body = limited(req.body, limit, state);

  if (multipart) {
    let form: FormData;
    try {
      // The multipart parser reads from the counting stream, so it stops at the limit too.
      form = await new Response(body, { headers: { 'content-type': type } }).formData();
    } catch {
      if (state.exceeded) throw tooLarge();
      throw new AppError('invalid', 'The upload could not be read; try again.');
    }
    const file = form.get('file');
    if (!(file instanceof File)) throw new AppError('invalid', 'Choose a file to upload.', { file: ['Choose a file to upload.'] });
    if (file.size > maxBytes) throw tooLarge();
    const fields = Object.fromEntries([...form.entries()].filter(([, v]) => typeof v === 'string') as [string, string][]);
    return { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()), fields };
  }

  try {
    return { name: 'upload', bytes: await readAll(body), fields: {} };
  } catch (error) {
    if (state.exceeded) throw tooLarge();
    throw error;
  }
}
