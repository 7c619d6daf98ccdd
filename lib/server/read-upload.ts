import { AppError } from './errors';

/**
 * Reads an uploaded file (multipart field "file", or the raw body) without trusting the declared size:
 * a declared length over the limit is refused before reading, and reading stops at the limit.
 */
export async function readUpload(req: Request, maxBytes: number): Promise<{ name: string; bytes: Uint8Array; fields: Record<string, string> }> {
  const tooLarge = () => new AppError('payload-too-large', `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB; nothing was imported.`);
  const declared = Number(req.headers.get('content-length') ?? '0');
  // A multipart body carries a little framing besides the file.
  if (declared > maxBytes + 64 * 1024) throw tooLarge();
  const type = req.headers.get('content-type') ?? '';
  if (type.startsWith('multipart/form-data')) {
    let form: FormData;
    try {
      form = await req.formData();
    } catch {
      throw new AppError('invalid', 'The upload could not be read; try again.');
    }
    const file = form.get('file');
    if (!(file instanceof File)) throw new AppError('invalid', 'Choose a file to upload.', { file: ['Choose a file to upload.'] });
    if (file.size > maxBytes) throw tooLarge();
    const fields = Object.fromEntries([...form.entries()].filter(([, v]) => typeof v === 'string') as [string, string][]);
    return { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()), fields };
  }
  if (!req.body) throw new AppError('invalid', 'The request has no file.');
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.length;
    if (size > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(size);
  let offset = 0;
  for (const c of chunks) {
    bytes.set(c, offset);
    offset += c.length;
  }
  return { name: 'upload', bytes, fields: {} };
}
