import { InputError } from '@/lib/errors/input-error';
import { anodePositionSchema, type AnodePosition } from '@/lib/schemas/anode-position';
import { PARSER_VERSION, outOfRange, parsePosition, withinSchema, type PositionAssetKind } from './parse-position';

/** Words for a field of a position in a message. */
const FIELD_WORDS: Partial<Record<keyof AnodePosition, string>> = {
  frameFrom: 'frame',
  frameTo: 'frame',
  heightAboveKeelM: 'height above the keel',
  depthBelowDatumM: 'depth',
  pileFrom: 'pile',
  pileTo: 'pile',
  note: 'text',
};

/**
 * What a write stores as a group's position: the text read for the asset's kind, with the parser's version beside
 * it; nothing without a text. A position the schema refuses (a frame past 2000, a height past 60 m) is not stored:
 * the write is refused whole with a message on `field`, the form's position field (422).
 */
export function storedPosition(text: string | null | undefined, kind: PositionAssetKind, field = 'positions'): { position: AnodePosition | null; positionParserVersion: number | null } {
  if (!text || !text.trim()) return { position: null, positionParserVersion: null };
  const parsed = parsePosition(text, kind);
  const bad = outOfRange(parsed);
  if (bad.length) {
    const first = bad[0]!;
    throw new InputError(field, `This position reads as a ${FIELD_WORDS[first.key] ?? 'value'} that cannot be right: use ${first.allowed}, or write the position in other words.`);
  }
  return { position: anodePositionSchema.parse(parsed), positionParserVersion: PARSER_VERSION };
}

/**
 * A group's position as data: the stored one when the current parser wrote it and it checks against the schema,
 * else the text read again (a row from an older parser version, from before positions were stored, or from a bulk
 * script that left it out), with anything outside the schema moved back to the note. Every reader (page, PDFs,
 * anode list, register CSV) goes through here, so they all say the same. Never throws.
 */
export function positionOf(group: { position?: unknown; positionParserVersion?: number | null; positions?: string | null }, kind?: PositionAssetKind): AnodePosition {
  if (group.position !== null && group.position !== undefined && group.positionParserVersion === PARSER_VERSION) {
    const stored = anodePositionSchema.safeParse(group.position);
    if (stored.success) return stored.data;
  }
  return withinSchema(parsePosition(group.positions ?? null, kind), group.positions);
}
