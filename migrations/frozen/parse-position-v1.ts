import type { AnodePosition, HullPlace, PileRef, TidalDatum } from '../../lib/schemas/anode-position';

const EMPTY_POSITION: AnodePosition = { frameFrom: null, frameTo: null, side: null, heightAboveKeelM: null, place: null, end: null, pileFrom: null, pileTo: null, depthBelowDatumM: null, datum: null, note: null };

/*
 * FROZEN: the position parser as Migration20261214000000_structured_positions first ran it (parser version 1).
 * A migration must give the same result on a fresh install as it gave on an upgraded one, so it never imports the
 * live parser (lib/drawings/parse-position.ts). Rows it wrote carry no parser version and are read again from
 * their text by positionOf. Do not edit.
 *
 * Reads a position as yards, planners and divers write it ("Fr 22–30 P", "frames 118 to 124 stbd, 1.2 m above keel",
 * "sea chest SB aft", "Pile B7 −2.0 m LAT", "bent 3 row C, 1.5 m below MLWS") into an AnodePosition. Each rule takes
 * the words it understood out of the text; what is left (less stray "and", "at" and commas) is the note, so nothing
 * written is lost. Pure: no I/O.
 */

/** A rule sets fields from a match; it returns false when the match says something else than what is already set (the words then stay in the note). */
type Rule = { pattern: RegExp; apply: (p: AnodePosition, m: RegExpExecArray) => boolean | void };

const num = (s: string) => Number(s.replace(/\s+/g, ''));
const round = (x: number) => Math.round(x * 1000) / 1000;

const DATUM_WORDS: [RegExp, TidalDatum][] = [
  [/^lat$/i, 'LAT'],
  [/^(?:cd|chart\s+datum)$/i, 'CD'],
  [/^mlws$/i, 'MLWS'],
  [/^mllw$/i, 'MLLW'],
  [/^mlw$/i, 'MLW'],
  [/^msl$/i, 'MSL'],
  [/^(?:lw|low\s+water)$/i, 'LW'],
];
const datumOf = (word: string): TidalDatum => DATUM_WORDS.find(([re]) => re.test(word.trim()))![1];

const ref = (bent: string | undefined, row: string | undefined): PileRef => ({ bent: bent ? Number(bent) : null, row: row ? row.toUpperCase() : null });
function setPiles(p: AnodePosition, from: PileRef, to: PileRef | null): boolean {
  if (p.pileFrom) return false;
  p.pileFrom = from;
  p.pileTo = to && (to.bent !== from.bent || to.row !== from.row) ? to : null;
  return true;
}
function setPlace(p: AnodePosition, place: HullPlace): boolean {
  if (p.place && p.place !== place) return false;
  p.place = place;
  return true;
}
/** Sets a field unless it holds another value already. */
function setOnce<K extends 'side' | 'end'>(p: AnodePosition, key: K, value: NonNullable<AnodePosition[K]>): boolean {
  if (p[key] !== null && p[key] !== value) return false;
  p[key] = value;
  return true;
}

const RULES: Rule[] = [
  // Height above the keel (or base line): "1.2 m above keel".
  {
    pattern: /(\d+(?:\.\d+)?)\s*m\s+(?:above|abv\.?)\s+(?:the\s+)?(?:keel|base\s*line|BL)\b/gi,
    apply: (p, m) => {
      if (p.heightAboveKeelM !== null) return false;
      p.heightAboveKeelM = num(m[1]);
    },
  },
  // A level against a tidal datum: "-2.0 m LAT", "1.5 m below MLWS", "at -4 m CD", "+0.5 m CD". A signed or bare
  // value is a level (minus is below the datum); "below" and "above" say it in words.
  {
    pattern: /(?:\bat\s+)?([+-]?)\s?(\d+(?:\.\d+)?)\s*m\s*(?:(below|under|above)\s+)?(LAT|CD|MLWS|MLLW|MLW|MSL|LW|chart\s+datum|low\s+water)\b/gi,
    apply: (p, m) => {
      if (p.datum) return false;
      const value = num(m[2]);
      const word = m[3]?.toLowerCase();
      const below = word ? word !== 'above' : m[1] === '-';
      p.depthBelowDatumM = round(below ? value : -value) || 0;
      p.datum = datumOf(m[4]);
    },
  },
  // Frames: "Fr 22-30", "Fr. 144-150", "frames 118 to 124", "Frame 12 to frame 18", "FR 40".
  {
    pattern: /\b(?:frames?|frs?)\.?\s*(\d{1,4})(?:\s*(?:-|to)\s*(?:(?:frames?|frs?)\.?\s*)?(\d{1,4}))?\b/gi,
    apply: (p, m) => {
      if (p.frameFrom !== null) return false;
      const a = Number(m[1]);
      const b = m[2] ? Number(m[2]) : a;
      p.frameFrom = Math.min(a, b);
      p.frameTo = Math.max(a, b);
    },
  },
  // Piles by bent and row: "B1-A", "B1-A to B6-D" (B for bent, then the row letter).
  {
    pattern: /\bB(\d{1,3})\s*-\s*([A-Z])\b(?:\s*(?:to|-)\s*B(\d{1,3})\s*-\s*([A-Z])\b)?/g,
    apply: (p, m) => setPiles(p, ref(m[1], m[2]), m[3] ? ref(m[3], m[4]) : null),
  },
  { pattern: /\bbent\s*(\d{1,3})\s*,?\s*row\s*([A-Z])\b/gi, apply: (p, m) => setPiles(p, ref(m[1], m[2]), null) },
  { pattern: /\brow\s*([A-Z])\s*,?\s*bent\s*(\d{1,3})\b/gi, apply: (p, m) => setPiles(p, ref(m[2], m[1]), null) },
  // Piles by row letter and number: "Pile B7", "pile A-4", "Piles C1 to C12".
  {
    pattern: /\bpiles?\s*([A-Z])\s*-?\s*(\d{1,3})\b(?:\s*(?:to|-)\s*(?:([A-Z])\s*-?\s*)?(\d{1,3})\b)?/gi,
    apply: (p, m) => setPiles(p, ref(m[2], m[1]), m[4] ? ref(m[4], m[3] ?? m[1]) : null),
  },
  // Whole bents or rows: "Bents 7-12", "row C".
  { pattern: /\bbents?\s*(\d{1,3})(?:\s*(?:-|to)\s*(\d{1,3}))?\b/gi, apply: (p, m) => setPiles(p, ref(m[1], undefined), m[2] ? ref(m[2], undefined) : null) },
  { pattern: /\brows?\s*([A-Z])(?:\s*(?:-|to)\s*([A-Z]))?\b/gi, apply: (p, m) => setPiles(p, ref(undefined, m[1]), m[2] ? ref(undefined, m[2]) : null) },
  // Parts of the hull.
  {
    pattern: /\b(?:(bow|stern|fwd|forward|aft)\s+)?(?:thruster\s+tunnels?|thrusters?|tunnels?)\b/gi,
    apply: (p, m) => {
      if (!setPlace(p, 'thruster-tunnel')) return false;
      if (m[1]) setOnce(p, 'end', /^(?:stern|aft)$/i.test(m[1]) ? 'aft' : 'fore');
    },
  },
  { pattern: /\bsea\s*-?\s*chests?\b/gi, apply: (p) => setPlace(p, 'sea-chest') },
  { pattern: /\brudders?\b/gi, apply: (p) => setPlace(p, 'rudder') },
  {
    pattern: /\b(?:stern\s+frame|stern\s+tube|stern\s+boss|shaft\s+brackets?|A-brackets?|propeller\s+shafts?|propeller\s+boss|shafts?|propellers?(?!\s+tips?))\b/gi,
    apply: (p, m) => {
      if (!setPlace(p, 'propeller-shaft')) return false;
      if (/stern/i.test(m[0])) setOnce(p, 'end', 'aft');
    },
  },
  { pattern: /\b(?:flat\s+(?:of\s+)?bottom|bottom|bilge\s+keels?|bilge\s+strakes?|bilges?|keels?)\b/gi, apply: (p) => setPlace(p, 'hull-bottom') },
  { pattern: /\b(?:boot-?\s*tops?|topsides?|sides)\b/gi, apply: (p) => setPlace(p, 'boot-top-sides') },
  // Sides: both first, so "P and S" is not read as port.
  { pattern: /\b(?:P\s*(?:\/|&|\+|and)\s*S|S\s*(?:\/|&|and)\s*P|PS|P\/SB)\b/g, apply: (p) => setOnce(p, 'side', 'both') },
  { pattern: /\b(?:port\s*(?:and|&|\/)\s*starboard|both\s+sides)\b/gi, apply: (p) => setOnce(p, 'side', 'both') },
  { pattern: /\bport(?:\s+side)?\b/gi, apply: (p) => setOnce(p, 'side', 'port') },
  { pattern: /\bP\b/g, apply: (p) => setOnce(p, 'side', 'port') },
  { pattern: /\b(?:starboard|stbd|stb|sb)(?:\s+side)?\b/gi, apply: (p) => setOnce(p, 'side', 'starboard') },
  { pattern: /\bS\b/g, apply: (p) => setOnce(p, 'side', 'starboard') },
  { pattern: /(?:\b(?:centre\s*line|center\s*line|on\s+centre|CL)\b|\bC\/L\b)/gi, apply: (p) => setOnce(p, 'side', 'centre') },
  // Which end, when no part of the hull said it.
  { pattern: /\b(?:aft|astern|stern)\b/gi, apply: (p) => setOnce(p, 'end', 'aft') },
  { pattern: /\b(?:fwd|forward|fore|bow)\b/gi, apply: (p) => setOnce(p, 'end', 'fore') },
];

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

/** The structured position a text describes, with what could not be read kept as the note. */
export function parsePositionV1(text: string | null | undefined): AnodePosition {
  const source = (text ?? '').replace(/[\u2010-\u2015\u2212]/g, '-').replace(/\s+/g, ' ').trim();
  const p: AnodePosition = { ...EMPTY_POSITION };
  if (!source) return p;
  let rest = source;
  for (const rule of RULES) {
    rest = rest.replace(rule.pattern, (...args) => {
      const m = args.slice(0, -2) as unknown as RegExpExecArray;
      // Words that contradict what is already read stay in the note, so nothing written is lost.
      return rule.apply(p, m) === false ? m[0] : ' ';
    });
  }
  const note = leftover(rest);
  // Nothing understood: the text is kept whole, as written.
  const understood = Object.entries(p).some(([k, v]) => k !== 'note' && v !== null);
  p.note = understood ? note : source;
  return p;
}
