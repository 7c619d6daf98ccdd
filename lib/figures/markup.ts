/*
 * SVG markup built as strings (the drawings and the depletion chart): escaping, and the version of a figure that
 * its address carries, so a browser keeps a figure until it changes. Pure and browser-safe (no node:crypto): the
 * pile elevation draws on the phone with the same functions.
 */

/** Text and attribute values escaped for markup built as a string. */
export function escapeMarkup(value: string | number): string {
  return String(value).replace(/[&<>"']/g, (c) => (c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&#x27;'));
}

/**
 * A short version of a figure's markup (53-bit string hash, two multiplicative mixes, as hex): the same markup
 * always gives the same version, a change gives another one with near certainty. Not a secret and not a
 * signature: it only tells a browser's kept copy from a new one.
 */
export function markupVersion(markup: string): string {
  let h1 = 0xdeadbeef;
  let h2 = 0x41c6ce57;
  for (let i = 0; i < markup.length; i++) {
    const c = markup.charCodeAt(i);
    h1 = Math.imul(h1 ^ c, 2654435761);
    h2 = Math.imul(h2 ^ c, 1597334677);
  }
  h1 = Math.imul(h1 ^ (h1 >>> 16), 2246822507) ^ Math.imul(h2 ^ (h2 >>> 13), 3266489909);
  h2 = Math.imul(h2 ^ (h2 >>> 16), 2246822507) ^ Math.imul(h1 ^ (h1 >>> 13), 3266489909);
  return (4294967296 * (2097151 & h2) + (h1 >>> 0)).toString(16).padStart(14, '0');
}

/** A standalone SVG document: what a figure's address serves and an <image> draws. */
export function svgDocument(width: number, height: number, content: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" font-family="Inter, 'Helvetica Neue', Arial, sans-serif">${content}</svg>`;
}

/** Markup already escaped (built by `html`): put into a template as it is. */
export class SafeHtml {
  // A private field makes the type nominal: a plain { value } object is not SafeHtml to the type checker.
  readonly #safe = true;
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

export type HtmlValue = string | number | SafeHtml | null | undefined | false | readonly HtmlValue[];

function htmlOf(value: HtmlValue): string {
  if (value === null || value === undefined || value === false) return '';
  if (value instanceof SafeHtml) return value.value;
  if (Array.isArray(value)) return value.map(htmlOf).join('');
  return escapeMarkup(value as string | number);
}

/**
 * HTML from a template, every value escaped (text and double-quoted attribute values alike) unless it is markup
 * `html` built; arrays are joined, null, undefined and false left out. For the pages' static parts (tables read,
 * never changed in the page): a few strings cost the server a fraction of the same markup as React elements,
 * which it walks twice per request (measured on the asset page, npm run bench).
 */
export function html(strings: TemplateStringsArray, ...values: HtmlValue[]): SafeHtml {
  let out = strings[0]!;
  for (let i = 0; i < values.length; i++) out += htmlOf(values[i]!) + strings[i + 1]!;
  return new SafeHtml(out);
}
