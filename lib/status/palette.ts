import type { AssetOutlook } from '@/lib/forecast/outlook';
import type { PotentialStatus, RemainingStatus } from '@/lib/surveys/criteria';

/**
 * One status palette for the whole product (safe for client code). Each tone means ONE thing wherever it is
 * shown; every state carries a word (the caller's) and a shape (the tone's) besides the colour, so a tag reads
 * in grey print and for anyone who does not tell the colours apart. DEVELOPERS.md, "Status colours", lists them.
 */
export const STATUS_TONES = ['action', 'soon', 'sound', 'progress', 'over', 'neutral'] as const;
export type StatusTone = (typeof STATUS_TONES)[number];

export type StatusShape = 'triangle' | 'clock' | 'check' | 'arrow' | 'plus' | 'dash';

export interface ToneSpec {
  /** What the colour means, in one line (the same line as DEVELOPERS.md). */
  meaning: string;
  colour: string;
  /** The shape drawn before the word. */
  shape: StatusShape;
  /** Tailwind classes of the tag: background, text and border. */
  classes: string;
}

export const TONE_SPECS: Readonly<Record<StatusTone, ToneSpec>> = {
  action: { meaning: 'red: action needed now (overdue, under-protected, payment overdue)', colour: 'state-action', shape: 'triangle', classes: 'bg-state-actionbg text-state-action border-state-action/40' },
  soon: { meaning: 'amber: due soon, waiting for a decision (renew at the next docking, a proposed renewal, an open invoice)', colour: 'state-soon', shape: 'clock', classes: 'bg-state-soonbg text-state-soon border-state-soon/40' },
  sound: { meaning: 'green: sound, nothing to do (protected, approved, done, paid, active)', colour: 'state-sound', shape: 'check', classes: 'bg-state-soundbg text-state-sound border-state-sound/40' },
  progress: { meaning: 'blue: in progress or booked (a checked design, a planned docking, a confirmed or ordered renewal, a free trial)', colour: 'state-progress', shape: 'arrow', classes: 'bg-state-progressbg text-state-progress border-state-progress/40' },
  over: { meaning: 'purple: over-protected, and nothing else', colour: 'state-over', shape: 'plus', classes: 'bg-state-overbg text-state-over border-state-over/40' },
  neutral: { meaning: 'grey: no data, not started or closed (draft, archived, cancelled)', colour: 'ink-soft', shape: 'dash', classes: 'bg-paper-sunk text-ink-soft border-rule-strong' },
};

/** A reading against the protection criteria. */
export const POTENTIAL_TONES: Readonly<Record<PotentialStatus, StatusTone>> = {
  'under-protected': 'action',
  protected: 'sound',
  'over-protected': 'over',
};

/** An asset's protection outlook (fleet overview, asset page, planner). Under-protection is red here as for a reading. */
export const OUTLOOK_TONES: Readonly<Record<AssetOutlook, StatusTone>> = {
  sound: 'sound',
  'no-anodes': 'neutral',
  'renew-at-next-docking': 'soon',
  overdue: 'action',
  'over-protected': 'over',
  'under-protected': 'action',
};

/** Remaining anode mass of a group, measured or forecast. */
export const REMAINING_TONES: Readonly<Record<RemainingStatus, StatusTone>> = {
  sound: 'sound',
  'renew-soon': 'soon',
  renew: 'action',
};

/** A design revision's workflow: a checked design is on its way to approval (blue), not a warning. */
export const DESIGN_STATUS_TONES: Readonly<Record<'draft' | 'checked' | 'approved', StatusTone>> = {
  draft: 'neutral',
  checked: 'progress',
  approved: 'sound',
};

/** A docking or campaign. */
export const DOCKING_STATUS_TONES: Readonly<Record<'planned' | 'done' | 'cancelled', StatusTone>> = {
  planned: 'progress',
  done: 'sound',
  cancelled: 'neutral',
};

/** A renewal at a docking: the scheduler's proposal waits for a planner (amber); booked is blue; fitted is closed. */
export const RENEWAL_STATUS_TONES: Readonly<Record<'proposed' | 'confirmed' | 'ordered' | 'fitted' | 'cancelled', StatusTone>> = {
  proposed: 'soon',
  confirmed: 'progress',
  ordered: 'progress',
  fitted: 'sound',
  cancelled: 'neutral',
};

/** The subscription as the payment service reports it (its own keys). */
export const SUBSCRIPTION_STATUS_TONES: Readonly<Record<string, StatusTone>> = {
  trialing: 'progress',
  active: 'sound',
  past_due: 'action',
  canceled: 'neutral',
  unpaid: 'action',
  incomplete: 'soon',
  incomplete_expired: 'neutral',
};

/** An invoice as the payment service reports it. */
export const INVOICE_STATUS_TONES: Readonly<Record<string, StatusTone>> = {
  paid: 'sound',
  open: 'soon',
  draft: 'neutral',
  void: 'neutral',
  uncollectible: 'action',
};

/**
 * Where an item of the phone's capture queue stands (lib/offline/capture-state.ts): waiting and sending are in
 * progress (blue), sent is sound, needing the member red. Amber stays for "due soon / a decision".
 */
export const CAPTURE_STATE_TONES: Readonly<Record<'waiting' | 'sending' | 'sent' | 'conflict' | 'invalid' | 'failed', StatusTone>> = {
  waiting: 'progress',
  sending: 'progress',
  sent: 'sound',
  conflict: 'action',
  invalid: 'action',
  failed: 'action',
};

/** The tone of a value from one of the maps above; anything unknown is neutral rather than a guess. */
export function toneOf(map: Readonly<Record<string, StatusTone>>, value: string | null | undefined): StatusTone {
  return (value != null && map[value]) || 'neutral';
}
