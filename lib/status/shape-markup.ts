import type { StatusShape } from './palette';

/*
 * The inside of each tone's shape (a 10 × 10 drawing in the text colour), as markup: one source for the status tag
 * the React pages draw (StatusTag) and the one the static parts of a page are built with (statusTagHtml).
 */
export const SHAPE_MARKUP: Record<StatusShape, string> = {
  triangle: '<path d="M5 0.6 L9.6 9.2 H0.4 Z" fill="currentColor"></path><path d="M5 3.4 V6.2 M5 7.2 V7.9" stroke="#fff" stroke-width="1.2"></path>',
  clock: '<circle cx="5" cy="5" r="4.2" fill="none" stroke="currentColor" stroke-width="1.4"></circle><path d="M5 2.4 V5 H7.2" fill="none" stroke="currentColor" stroke-width="1.3"></path>',
  check: '<path d="M1 5.4 L3.9 8.2 L9 1.8" fill="none" stroke="currentColor" stroke-width="1.7"></path>',
  arrow: '<path d="M0.8 5 H8 M5 1.8 L8.4 5 L5 8.2" fill="none" stroke="currentColor" stroke-width="1.5"></path>',
  plus: '<circle cx="5" cy="5" r="4.3" fill="currentColor"></circle><path d="M5 2.5 V7.5 M2.5 5 H7.5" stroke="#fff" stroke-width="1.4"></path>',
  dash: '<path d="M1.5 5 H8.5" stroke="currentColor" stroke-width="1.6"></path>',
};

/** The classes of the tag around the word and the shape (StatusTag and statusTagHtml). */
export const STATUS_TAG_CLASSES = 'inline-flex items-center gap-1 rounded-[3px] border px-1.5 py-0.5 text-xs font-medium';
