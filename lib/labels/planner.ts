/**
 * Words for dockings, campaigns and renewals (safe for client code). They follow the asset: a vessel is
 * docked at a yard; a structure (a jetty, a dolphin) is never docked: its anodes are renewed in a diving
 * campaign by a contractor.
 */
export type AssetKind = 'vessel' | 'structure';

export interface EventWords {
  /** In a sentence: "docking" / "campaign". */
  event: string;
  /** At the start of a sentence or as a heading: "Docking" / "Campaign". */
  Event: string;
  /** Plural in a sentence: "dockings" / "campaigns". */
  events: string;
  Events: string;
  /** Who does the work, in a sentence: "yard" / "contractor". */
  place: string;
  Place: string;
  /** The work as a verb phrase: "dock" / "hold a diving campaign". */
  verb: string;
}

const VESSEL_WORDS: EventWords = { event: 'docking', Event: 'Docking', events: 'dockings', Events: 'Dockings', place: 'yard', Place: 'Yard', verb: 'dock' };
const STRUCTURE_WORDS: EventWords = {
  event: 'campaign',
  Event: 'Campaign',
  events: 'campaigns',
  Events: 'Campaigns',
  place: 'contractor',
  Place: 'Contractor',
  verb: 'hold a diving campaign',
};

/** The words of the asset's work: a docking at a yard for a vessel, a campaign by a contractor for a structure. */
export function eventWords(assetKind: string): EventWords {
  return assetKind === 'structure' ? STRUCTURE_WORDS : VESSEL_WORDS;
}

/** For pages that list vessels and structures together. */
export const MIXED_EVENT_WORDS = { events: 'dockings and campaigns', Events: 'Dockings and campaigns', event: 'docking or campaign', place: 'yard or contractor', Place: 'Yard or contractor' } as const;

/** The kinds of booking, one name each everywhere (planner, docking page, anode list, e-mails). */
export const DOCKING_KIND_LABELS: Record<string, string> = {
  intermediate: 'Intermediate docking',
  'renewal-survey': 'Renewal survey docking',
  unplanned: 'Unplanned docking',
  campaign: 'Diving campaign',
};

/** "Intermediate docking", "Diving campaign": the kind of booking in words. */
export const dockingKindWords = (kind: string): string => DOCKING_KIND_LABELS[kind] ?? 'Docking';

/** The kinds a planner can book for an asset of this kind (a structure is only ever a campaign). */
export function dockingKindOptions(assetKind?: string): { value: string; label: string }[] {
  const kinds = assetKind === 'structure' ? ['campaign'] : assetKind === 'vessel' ? ['intermediate', 'renewal-survey', 'unplanned'] : Object.keys(DOCKING_KIND_LABELS);
  return kinds.map((value) => ({ value, label: DOCKING_KIND_LABELS[value]! }));
}

export const DOCKING_STATUS_LABELS: Record<string, string> = { planned: 'Planned', done: 'Done', cancelled: 'Cancelled' };

export const RENEWAL_STATUS_LABELS: Record<string, string> = {
  proposed: 'Proposed',
  confirmed: 'Confirmed',
  ordered: 'Ordered',
  fitted: 'Fitted',
  cancelled: 'Cancelled',
};

/** Why a renewal is booked. */
export const RENEWAL_REASON_LABELS: Record<string, string> = {
  'forecast-depletion': 'Forecast depletion',
  'survey-finding': 'Survey finding',
  damage: 'Damage',
  other: 'Other',
};
