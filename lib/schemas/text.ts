import { z } from 'zod';

/*
 * The one string schema for text that crosses a boundary (forms, JSON bodies, query strings, stored
 * records read back). Every other schema builds its strings from `text()` / `multilineText()` so that
 * no field lets through what PostgreSQL cannot store or what breaks a page:
 * - a NUL byte (PostgreSQL refuses it in text and jsonb, which used to surface as a 500);
 * - the other C0 control characters and DEL (invisible, and they break CSV, PDF and e-mail output);
 *   a tab is allowed everywhere, line breaks only in multi-line fields (notes, comments);
 * - a lone UTF-16 surrogate (half of an emoji: not valid Unicode, so it cannot be encoded as UTF-8).
 */

/** C0 controls except tab, line feed and carriage return, and DEL. */
const CONTROL_IN_MULTILINE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
/** C0 controls except tab, and DEL: a single-line field holds no line break either. */
const CONTROL_IN_LINE = /[\u0000-\u0008\u000A-\u001F\u007F]/;
/** A high surrogate not followed by a low one, or a low surrogate not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export const CONTROL_CHARACTER_MESSAGE = 'Remove the control character (such as a NUL byte) from this field.';
export const LINE_BREAK_MESSAGE = 'Keep this field on one line.';
export const BROKEN_CHARACTER_MESSAGE = 'This field holds a broken character (half of an emoji or symbol); type it again.';

/** What is wrong with a text, in plain English, or null when it can be stored and shown. */
export function textProblem(value: string, { multiline = false } = {}): string | null {
  if ((multiline ? CONTROL_IN_MULTILINE : CONTROL_IN_LINE).test(value)) {
    return !multiline && /[\n\r]/.test(value) && !CONTROL_IN_MULTILINE.test(value) ? LINE_BREAK_MESSAGE : CONTROL_CHARACTER_MESSAGE;
  }
  if (LONE_SURROGATE.test(value)) return BROKEN_CHARACTER_MESSAGE;
  return null;
}

/** Whether a text can be stored and shown (see textProblem). */
export const isCleanText = (value: string, options?: { multiline?: boolean }) => textProblem(value, options) === null;

type StringParams = Parameters<typeof z.string>[0];

function cleanString(multiline: boolean, params?: StringParams) {
  return z.string(params).check((ctx) => {
    const problem = textProblem(ctx.value, { multiline });
    // Abort: the length and format checks after it would only add noise to a value that cannot be kept.
    if (problem) ctx.issues.push({ code: 'custom', message: problem, input: ctx.value, continue: false });
  });
}

/** A single-line text (names, labels, references, query strings, ids before their own check). */
export const text = (params?: StringParams) => cleanString(false, params);

/** A text that may hold line breaks (notes, comments, reasons typed in a text area). */
export const multilineText = (params?: StringParams) => cleanString(true, params);
