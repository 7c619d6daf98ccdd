import { EMPTY_POSITION, anodePositionSchema, type AnodePosition, type HullPlace, type PileRef, type TidalDatum } from '@/lib/schemas/anode-position';
import { HULL_END_LABELS, HULL_SIDE_LABELS, TIDAL_DATUM_LABELS, ZONE_KIND_LABELS, inSentence } from '@/lib/labels';

/*
 * Reads a position as yards, planners and divers write it ("Fr 22–30 P", "frames 118 to 124 stbd, 1.2 m above keel",
 * "sea chest SB aft", "Pile B7 −2.0 m LAT", "bent 3 row C, 1.5 m below MLWS") into an AnodePosition. Each rule takes
 * the words it understood out of the text; what is left (less stray "and", "at" and commas) is the note, so nothing
 * written is lost. Pure: no I/O.
 */

/** Which kind of asset a text describes: hull words are not read on a structure, pile words not on a vessel. */
export type PositionAssetKind = 'vessel' | 'structure';

/**
 * The parser's version, stored beside each position it wrote (anode_group.position_parser_version): a stored
 * position from an older version is read again from its text, so a fix to the parser reaches every row.
 */
export const PARSER_VERSION = 2;

/** The fields a rule fills; two different values for one of them make it unknown (null), the text kept in the note. */
type Field = 'frames' | 'side' | 'height' | 'place' | 'end' | 'piles' | 'depth';
/** What a rule did with a match: took its words, found it conflicts with a value already read, or left it (unread). */
type Outcome = void | 'conflict' | 'keep';
/** A rule sets fields from a match; `domain` says on which kind of asset its words mean something. */
type Rule = { field: Field; domain: 'hull' | 'pile' | 'any'; pattern: RegExp; apply: (p: AnodePosition, m: RegExpExecArray) => Outcome };

/** A number as written, with a decimal point or a decimal comma ("1,2"). */
const NUM = String.raw`\d+(?:[.,]\d+)?`;
const num = (s: string) => Number(s.replace(/\s+/g, '').replace(',', '.'));
const round = (x: number) => Math.round(x * 1000) / 1000;

// Longer names first: "low water springs" and LWS are mean low water springs, not plain low water.
const DATUM_WORDS: [RegExp, TidalDatum][] = [
  [/^lat$/i, 'LAT'],
  [/^(?:cd|chart\s+datum)$/i, 'CD'],
  [/^(?:mlws|lws|(?:mean\s+)?low\s+water\s+springs)$/i, 'MLWS'],
  [/^mllw$/i, 'MLLW'],
  [/^mlw$/i, 'MLW'],
  [/^msl$/i, 'MSL'],
  [/^(?:lw|low\s+water)$/i, 'LW'],
];
const DATUM_PATTERN = String.raw`LAT|CD|MLWS|LWS|(?:mean\s+)?low\s+water\s+springs|MLLW|MLW|MSL|LW|chart\s+datum|low\s+water`;
const datumOf = (word: string): TidalDatum => DATUM_WORDS.find(([re]) => re.test(word.trim()))![1];

/** A number that ends a range: not the start of a decimal ("-2,0") nor a length in metres ("-2 m"). */
const RANGE_END = String.raw`(\d{1,3})(?![.,]\d)(?!\s*m\b)\b`;

const ref = (bent: string | undefined, row: string | undefined): PileRef => ({ bent: bent ? Number(bent) : null, row: row ? row.toUpperCase() : null });
function setPiles(p: AnodePosition, from: PileRef, to: PileRef | null): Outcome {
  const next = { from, to: to && (to.bent !== from.bent || to.row !== from.row) ? to : null };
  if (p.pileFrom) return JSON.stringify([p.pileFrom, p.pileTo]) === JSON.stringify([next.from, next.to]) ? undefined : 'conflict';
  p.pileFrom = next.from;
  p.pileTo = next.to;
}
function setPlace(p: AnodePosition, place: HullPlace): Outcome {
  if (p.place && p.place !== place) return 'conflict';
  p.place = place;
}
/** Sets a field unless it holds another value already. */
function setOnce<K extends 'side' | 'end'>(p: AnodePosition, key: K, value: NonNullable<AnodePosition[K]>): Outcome {
  if (p[key] !== null && p[key] !== value) return 'conflict';
  p[key] = value;
}

const RULES: Rule[] = [
  // Height above the keel (or base line): "1.2 m above keel", "1,2 m above keel".
  {
    field: 'height',
    domain: 'hull',
    pattern: new RegExp(String.raw`(${NUM})\s*m\s+(?:above|abv\.?)\s+(?:the\s+)?(?:keel|base\s*line|BL)\b`, 'gi'),
    apply: (p, m) => {
      const value = num(m[1]);
      if (p.heightAboveKeelM !== null) return p.heightAboveKeelM === value ? undefined : 'conflict';
      p.heightAboveKeelM = value;
    },
  },
  // A level against a tidal datum: "-2.0 m LAT", "1.5 m below MLWS", "at -4 m CD", "+0.5 m CD". A signed value is a
  // level (minus is below the datum); "below" and "above" say it in words. A bare "2.0 m LAT" is left in the note:
  // chart practice writes depths below chart datum as positive numbers, so it could mean either. The second end of
  // a range ("-2 to -6 m CD", "between -2 m and -6 m CD") is not read as one level either.
  {
    field: 'depth',
    domain: 'any',
    pattern: new RegExp(String.raw`(?<!\d\s*(?:m\s*)?(?:to|and|-)\s*[+-]?\s?)(?:\bat\s+)?([+-]?)\s?(${NUM})\s*m\s*(?:(below|under|above)\s+)?(${DATUM_PATTERN})\b`, 'gi'),
    apply: (p, m) => {
      const word = m[3]?.toLowerCase();
      if (!word && !m[1]) return 'keep';
      const value = num(m[2]);
      const below = word ? word !== 'above' : m[1] === '-';
      const depth = round(below ? value : -value) || 0;
      const datum = datumOf(m[4]);
      if (p.datum) return p.datum === datum && p.depthBelowDatumM === depth ? undefined : 'conflict';
      p.depthBelowDatumM = depth;
      p.datum = datum;
    },
  },
  // Frames: "Fr 22-30", "Fr. 144-150", "frames 118 to 124", "Frame 12 to frame 18", "FR 40", "Fr 118/124". Not
  // "aft of Fr 40" or "forward of frame 12" (where the anodes are not), nor "4 of them within Fr 8-43" (a part of
  // them, said of the range already read): those stay in the note.
  {
    field: 'frames',
    domain: 'hull',
    pattern: /(?<!\b(?:aft|abaft|fwd|forward|ahead|before|behind|clear|within)\s+(?:of\s+)?)\b(?:frames?|frs?)\.?\s*(\d{1,4})(?![.,]\d)(?:\s*(?:-|to|\/)\s*(?:(?:frames?|frs?)\.?\s*)?(\d{1,4})(?![.,]\d)(?!\s*m\b))?\b/gi,
    apply: (p, m) => {
      const a = Number(m[1]);
      const b = m[2] ? Number(m[2]) : a;
      if (p.frameFrom !== null) return p.frameFrom === Math.min(a, b) && p.frameTo === Math.max(a, b) ? undefined : 'conflict';
      p.frameFrom = Math.min(a, b);
      p.frameTo = Math.max(a, b);
    },
  },
  // Piles by bent and row: "B1-A", "B1-A to B6-D", "B1-A/B6-D" (B for bent, then the row letter).
  {
    field: 'piles',
    domain: 'pile',
    pattern: /\bB(\d{1,3})\s*-\s*([A-Z])\b(?:\s*(?:to|-|\/)\s*B(\d{1,3})\s*-\s*([A-Z])\b)?/g,
    apply: (p, m) => setPiles(p, ref(m[1], m[2]), m[3] ? ref(m[3], m[4]) : null),
  },
  {
    field: 'piles',
    domain: 'pile',
    pattern: /\bbent\s*(\d{1,3})\s*,?\s*row\s*([A-Z])\b(?:\s*(?:to|-|\/)\s*bent\s*(\d{1,3})\s*,?\s*row\s*([A-Z])\b)?/gi,
    apply: (p, m) => setPiles(p, ref(m[1], m[2]), m[3] ? ref(m[3], m[4]) : null),
  },
  { field: 'piles', domain: 'pile', pattern: /\brow\s*([A-Z])\s*,?\s*bent\s*(\d{1,3})\b/gi, apply: (p, m) => setPiles(p, ref(m[2], m[1]), null) },
  // Piles by row letter and number: "Pile B7", "pile A-4", "Piles C1 to C12". The end of a range is never a number
  // followed by a decimal or by "m" ("Pile B7 -2,0 m LAT" is pile B7 at a level, not piles B7 to B2).
  {
    field: 'piles',
    domain: 'pile',
    pattern: new RegExp(String.raw`\bpiles?\s*([A-Z])\s*-?\s*(\d{1,3})(?![.,]\d)\b(?:\s*(?:to|-)\s*(?:([A-Z])\s*-?\s*)?${RANGE_END})?`, 'gi'),
    apply: (p, m) => setPiles(p, ref(m[2], m[1]), m[4] ? ref(m[4], m[3] ?? m[1]) : null),
  },
  // Whole bents or rows: "Bents 7-12", "row C".
  { field: 'piles', domain: 'pile', pattern: new RegExp(String.raw`\bbents?\s*(\d{1,3})(?![.,]\d)(?:\s*(?:-|to)\s*${RANGE_END})?\b`, 'gi'), apply: (p, m) => setPiles(p, ref(m[1], undefined), m[2] ? ref(m[2], undefined) : null) },
  { field: 'piles', domain: 'pile', pattern: /\brows?\s*([A-Z])(?:\s*(?:-|to)\s*([A-Z]))?\b/gi, apply: (p, m) => setPiles(p, ref(undefined, m[1]), m[2] ? ref(undefined, m[2]) : null) },
  // Parts of the hull.
  {
    field: 'place',
    domain: 'hull',
    pattern: /\b(?:(bow|stern|fwd|forward|aft)\s+)?(?:thruster\s+tunnels?|thrusters?|tunnels?)\b/gi,
    apply: (p, m) => {
      if (setPlace(p, 'thruster-tunnel') === 'conflict') return 'conflict';
      if (m[1]) setOnce(p, 'end', /^(?:stern|aft)$/i.test(m[1]) ? 'aft' : 'fore');
    },
  },
  { field: 'place', domain: 'hull', pattern: /\bsea\s*-?\s*chests?\b/gi, apply: (p) => setPlace(p, 'sea-chest') },
  { field: 'place', domain: 'hull', pattern: /\brudders?\b/gi, apply: (p) => setPlace(p, 'rudder') },
  {
    field: 'place',
    domain: 'hull',
    pattern: /\b(?:stern\s+frame|stern\s+tube|stern\s+boss|shaft\s+brackets?|A-brackets?|propeller\s+shafts?|propeller\s+boss|shafts?|propellers?(?!\s+tips?))\b/gi,
    apply: (p, m) => {
      if (setPlace(p, 'propeller-shaft') === 'conflict') return 'conflict';
      if (/stern/i.test(m[0])) setOnce(p, 'end', 'aft');
    },
  },
  { field: 'place', domain: 'hull', pattern: /\b(?:flat\s+(?:of\s+)?bottom|bottom|bilge\s+keels?|bilge\s+strakes?|bilges?|keels?)\b/gi, apply: (p) => setPlace(p, 'hull-bottom') },
  { field: 'place', domain: 'hull', pattern: /\b(?:boot-?\s*tops?|topsides?|sides)\b/gi, apply: (p) => setPlace(p, 'boot-top-sides') },
  // Sides, in either case ("fr 22 s"): both first, so "P and S" is not read as port. A letter after an apostrophe
  // ("the yard's") is not a side.
  { field: 'side', domain: 'hull', pattern: /(?<!['’])\b(?:P\s*(?:\/|&|\+|and)\s*S|S\s*(?:\/|&|and)\s*P|PS|P\/SB)\b/gi, apply: (p) => setOnce(p, 'side', 'both') },
  { field: 'side', domain: 'hull', pattern: /\b(?:port\s*(?:and|&|\/)\s*starboard|both\s+sides)\b/gi, apply: (p) => setOnce(p, 'side', 'both') },
  { field: 'side', domain: 'hull', pattern: /\bport(?:\s+side)?\b/gi, apply: (p) => setOnce(p, 'side', 'port') },
  { field: 'side', domain: 'hull', pattern: /(?<!['’])\bP\b/gi, apply: (p) => setOnce(p, 'side', 'port') },
  { field: 'side', domain: 'hull', pattern: /\b(?:starboard|stbd|stb|sb)(?:\s+side)?\b/gi, apply: (p) => setOnce(p, 'side', 'starboard') },
  { field: 'side', domain: 'hull', pattern: /(?<!['’])\bS\b/gi, apply: (p) => setOnce(p, 'side', 'starboard') },
  { field: 'side', domain: 'hull', pattern: /(?:\b(?:centre\s*line|center\s*line|on\s+centre|CL)\b|\bC\/L\b)/gi, apply: (p) => setOnce(p, 'side', 'centre') },
  // Which end, when no part of the hull said it ("aft of …" and "forward of …" say where not: left in the note).
  { field: 'end', domain: 'hull', pattern: /\b(?:aft|astern|stern)\b(?!\s+of\b)/gi, apply: (p) => setOnce(p, 'end', 'aft') },
  { field: 'end', domain: 'hull', pattern: /\b(?:fwd|forward|fore|bow)\b(?!\s+of\b)/gi, apply: (p) => setOnce(p, 'end', 'fore') },
];

/** The fields each rule field names in the position. */
const FIELD_KEYS: Record<Field, (keyof AnodePosition)[]> = {
  frames: ['frameFrom', 'frameTo'],
  side: ['side'],
  height: ['heightAboveKeelM'],
  place: ['place'],
  end: ['end'],
  piles: ['pileFrom', 'pileTo'],
  depth: ['depthBelowDatumM', 'datum'],
};

const CONNECTOR = /^(?:and|to|at|of|on|with|from|in|&|-|\/|\+)$/i;

/** What is left of the text once the rules took their words: its comma-separated pieces, stray connectors dropped. */
function leftover(rest: string): string | null {
  const pieces = rest
    .split(/[,;]+/)
    .map((piece) => {
      const words = piece.trim().split(/\s+/).filter(Boolean);
      while (words.length && CONNECTOR.test(words[0]!)) words.shift();
      while (words.length && CONNECTOR.test(words[words.length - 1]!)) words.pop();
      return words.join(' ');
    })
    .filter((piece) => /[\p{L}\p{N}]/u.test(piece));
  return pieces.length ? pieces.join(', ') : null;
}

/** A pile named in words no rule took ("and B1-B12", "pile C3"): the piles read would then be only part of them. */
const UNREAD_PILE = /\b(?:[A-Z]\d{1,3}(?:\s*-\s*[A-Z]\d{0,3})?|B\d{1,3}\s*-\s*[A-Z]|piles?\s+[A-Z]?\d{1,3})\b/;

/** One clause read by the rules: the fields, what was left, and the fields written twice with different values. */
function readClause(clause: string, kind: PositionAssetKind | undefined): { p: AnodePosition; rest: string; conflicts: Set<Field> } {
  const p: AnodePosition = { ...EMPTY_POSITION };
  const conflicts = new Set<Field>();
  let rest = clause;
  for (const rule of RULES) {
    if ((kind === 'structure' && rule.domain === 'hull') || (kind === 'vessel' && rule.domain === 'pile')) continue;
    rest = rest.replace(rule.pattern, (...args) => {
      const m = args.slice(0, -2) as unknown as RegExpExecArray;
      const outcome = rule.apply(p, m);
      if (outcome === 'conflict') conflicts.add(rule.field);
      // Words that were not read, or that contradict what is already read, stay in the note: nothing written is lost.
      return outcome ? m[0] : ' ';
    });
  }
  if (p.pileFrom && kind !== 'vessel' && UNREAD_PILE.test(rest)) conflicts.add('piles');
  return { p, rest, conflicts };
}

/**
 * The structured position a text describes, with what could not be read kept as the note. `kind` is the asset's:
 * on a structure "Pile 22 S" or "Port Louis berth" say nothing of a ship's side; on a vessel no pile words are read.
 * Clauses separated by ";" are read one by one. When the text gives two different values for one field (two sides,
 * two places, two frame ranges, two sets of piles, two levels), that field is left unknown and the note keeps the
 * whole text as written: the parser never picks one of them.
 */
export function parsePosition(text: string | null | undefined, kind?: PositionAssetKind): AnodePosition {
  const source = (text ?? '').replace(/[\u2010-\u2015\u2212]/g, '-').replace(/\s+/g, ' ').trim();
  if (!source) return { ...EMPTY_POSITION };
  const p: AnodePosition = { ...EMPTY_POSITION };
  const conflicts = new Set<Field>();
  const rests: string[] = [];
  for (const clause of source.split(';')) {
    const read = readClause(clause, kind);
    read.conflicts.forEach((f) => conflicts.add(f));
    rests.push(read.rest);
    for (const [field, keys] of Object.entries(FIELD_KEYS) as [Field, (keyof AnodePosition)[]][]) {
      if (keys.every((k) => read.p[k] === null)) continue;
      if (keys.every((k) => p[k] === null)) for (const k of keys) (p as Record<string, unknown>)[k] = read.p[k];
      else if (keys.some((k) => JSON.stringify(p[k]) !== JSON.stringify(read.p[k]))) conflicts.add(field);
    }
  }
  for (const field of conflicts) for (const k of FIELD_KEYS[field]) (p as Record<string, unknown>)[k] = null;
  const understood = Object.entries(p).some(([k, v]) => k !== 'note' && v !== null);
  // Nothing understood, or something said twice: the text is kept whole, as written.
  p.note = understood && !conflicts.size ? leftover(rests.join(';')) : source;
  return p;
}

/** What the schema allows of each field, in words, for the message of a position that cannot be stored. */
const RANGE_WORDS: Partial<Record<keyof AnodePosition, string>> = {
  frameFrom: 'a frame number from −50 to 2000',
  frameTo: 'a frame number from −50 to 2000',
  heightAboveKeelM: 'a height above the keel from 0 to 60 m',
  depthBelowDatumM: 'a depth from 30 m above to 300 m below the datum',
  pileFrom: 'a bent from 1 to 999',
  pileTo: 'a bent from 1 to 999',
};

/** The fields of a parsed position outside what the schema allows, each with what it allows. */
export function outOfRange(p: AnodePosition): { key: keyof AnodePosition; allowed: string }[] {
  const checked = anodePositionSchema.safeParse(p);
  if (checked.success) return [];
  const keys = [...new Set(checked.error.issues.map((i) => i.path[0] as keyof AnodePosition))];
  return keys.map((key) => ({ key, allowed: RANGE_WORDS[key] ?? 'a shorter text' }));
}

/**
 * The position with every value outside the schema moved back into the note (the whole text kept as written), so
 * it always checks against anodePositionSchema. For rows already stored; a new write is refused instead.
 */
export function withinSchema(p: AnodePosition, text: string | null | undefined): AnodePosition {
  const bad = outOfRange(p);
  if (!bad.length) return p;
  const out: AnodePosition = { ...p };
  for (const { key } of bad) {
    if (key === 'frameFrom' || key === 'frameTo') Object.assign(out, { frameFrom: null, frameTo: null });
    else if (key === 'pileFrom' || key === 'pileTo') Object.assign(out, { pileFrom: null, pileTo: null });
    else if (key === 'depthBelowDatumM' || key === 'datum') Object.assign(out, { depthBelowDatumM: null, datum: null });
    else if (key !== 'note') (out as Record<string, unknown>)[key] = null;
  }
  const source = (text ?? '').replace(/\s+/g, ' ').trim();
  out.note = source ? source.slice(0, 2000) : null;
  return anodePositionSchema.parse(out);
}

const metres = (x: number) => `${Math.round(x * 100) / 100} m`;
const pileWords = (r: PileRef) => [r.bent !== null ? `bent ${r.bent}` : null, r.row !== null ? `row ${r.row}` : null].filter(Boolean).join(' ');

/** The position's frames or piles and the depth or height, without the note (what a drawing's list shows). */
export function positionPlaceWords(p: AnodePosition): string | null {
  const parts: string[] = [];
  if (p.place) parts.push(inSentence(ZONE_KIND_LABELS[p.place] ?? p.place));
  if (p.end) parts.push(HULL_END_LABELS[p.end]);
  if (p.frameFrom !== null) parts.push(p.frameTo !== null && p.frameTo !== p.frameFrom ? `frames ${p.frameFrom}–${p.frameTo}` : `frame ${p.frameFrom}`);
  if (p.side) parts.push(HULL_SIDE_LABELS[p.side]);
  if (p.heightAboveKeelM !== null) parts.push(`${metres(p.heightAboveKeelM)} above keel`);
  if (p.pileFrom) parts.push(p.pileTo ? `piles ${pileWords(p.pileFrom)} to ${pileWords(p.pileTo)}` : `pile ${pileWords(p.pileFrom)}`);
  if (p.datum) {
    const d = p.depthBelowDatumM ?? 0;
    parts.push(d === 0 ? `at ${TIDAL_DATUM_LABELS[p.datum]}` : `${metres(Math.abs(d))} ${d > 0 ? 'below' : 'above'} ${TIDAL_DATUM_LABELS[p.datum]}`);
  }
  if (!parts.length) return null;
  const words = parts.join(', ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** A position in words, the note last ("Frames 118–124, starboard, 1.2 m above keel"); null when nothing is known. */
export function formatPosition(p: AnodePosition): string | null {
  const place = positionPlaceWords(p);
  if (place && p.note) return `${place}; ${p.note}`;
  return place ?? p.note;
}
