import { ZodError } from 'zod';
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { InputError } from '@/lib/errors/input-error';
import { StorageMisconfiguredError, StorageUnavailableError, STORAGE_MISCONFIGURED_MESSAGE, STORAGE_UNAVAILABLE_MESSAGE } from './storage/storage-error';

// One error type for the whole server side; the code decides the HTTP status and what the user sees.
export type AppErrorCode = 'unauthenticated' | 'forbidden' | 'not-found' | 'conflict' | 'invalid' | 'rate-limited' | 'read-only' | 'payload-too-large' | 'unsupported' | 'unavailable';

const STATUS: Record<AppErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  invalid: 422,
  'rate-limited': 429,
  'read-only': 423,
  'payload-too-large': 413,
  unsupported: 415,
  unavailable: 503,
};

export class AppError extends Error {
  constructor(
    readonly code: AppErrorCode,
    message: string,
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = 'AppError';
  }
  get status() {
    return STATUS[this.code];
  }
}

export const notFound = (what = 'That item') => new AppError('not-found', `${what} was not found.`);

/** The one shape every failure takes on its way to a client. */
export interface ErrorBody {
  error: { code: AppErrorCode | 'internal' | 'misconfigured'; message: string; fieldErrors?: Record<string, string[]> };
}

export function fieldErrorsFromZod(error: ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_form';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function toErrorBody(error: unknown): { status: number; body: ErrorBody } {
  if (error instanceof AppError) {
    const fieldErrors = Object.keys(error.fieldErrors).length ? error.fieldErrors : undefined;
    return { status: error.status, body: { error: { code: error.code, message: error.message, fieldErrors } } };
  }
  if (error instanceof InputError) {
    return { status: 422, body: { error: { code: 'invalid', message: error.message, fieldErrors: { [error.field]: [error.message] } } } };
  }
  if (error instanceof UniqueConstraintViolationException) {
    // Two requests raced to create the same thing; the database kept one and refused the other.
    return { status: 409, body: { error: { code: 'conflict', message: 'That already exists (it was just created by another request). Reload and check.' } } };
  }
  if (error instanceof StorageMisconfiguredError) {
    // Not an outage: the storage refused the app's own keys or bucket. Loud, because nothing will work until fixed.
    console.error(`[tidewarden] STORAGE MISCONFIGURED: ${error.message}`, error.cause instanceof Error ? `${error.cause.name}: ${error.cause.message}` : error.cause);
    return { status: 500, body: { error: { code: 'misconfigured', message: STORAGE_MISCONFIGURED_MESSAGE } } };
  }
  if (error instanceof StorageUnavailableError) {
    // The unit of work rolled back; the operator's log gets the storage's own answer.
    console.error(`[tidewarden] ${error.message}`, error.cause instanceof Error ? error.cause.message : error.cause);
    return { status: 503, body: { error: { code: 'unavailable', message: STORAGE_UNAVAILABLE_MESSAGE } } };
  }
  if (error instanceof ZodError) {
    return { status: 422, body: { error: { code: 'invalid', message: 'Some fields need attention.', fieldErrors: fieldErrorsFromZod(error) } } };
  }
  // Unexpected: log the detail for operators, never send it to the client.
  console.error('[tidewarden] unexpected error', error);
  return { status: 500, body: { error: { code: 'internal', message: 'Something went wrong on our side; nothing was changed. Please try again.' } } };
}
