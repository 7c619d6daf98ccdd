/**
 * The caution every engineering screen carries (the design desk, the asset page, the fleet overview,
 * the docking planner), the calculation note and the landing page: one sentence, kept here so they
 * all say the same thing. Safe for client code.
 */
export const CAUTION_SENTENCE =
  'Preliminary results: verify against the governing standard, class and local rules; a qualified corrosion engineer must review them before use.';
