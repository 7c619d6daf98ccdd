import { anodePositionSchema, type AnodePosition } from '@/lib/schemas/anode-position';
import { parsePosition } from './parse-position';

/** What a write stores as a group's position: the text parsed, or null without a text. */
export function storedPosition(text: string | null | undefined): AnodePosition | null {
  return text && text.trim() ? parsePosition(text) : null;
}

/**
 * A group's position as data: the stored one when it checks against the schema, else the text parsed again (a row
 * written before positions were stored, or by a bulk script that left it out). Never throws.
 */
export function positionOf(group: { position?: unknown; positions?: string | null }): AnodePosition {
  if (group.position !== null && group.position !== undefined) {
    const stored = anodePositionSchema.safeParse(group.position);
    if (stored.success) return stored.data;
  }
  return parsePosition(group.positions ?? null);
}
