import type { AssetOutlook } from '@/lib/forecast/outlook';

/**
 * The protection outlook of an asset in words: the one place the fleet overview, the asset page, the
 * docking planner and the weekly digest take them from (safe for client code).
 */
export const OUTLOOK_WORDS: Readonly<Record<AssetOutlook, string>> = {
  sound: 'Sound',
  'no-anodes': 'No anodes recorded',
  'renew-at-next-docking': 'Renew at next docking',
  overdue: 'Overdue',
  'over-protected': 'Over-protected by survey',
  'under-protected': 'Under-protected by survey',
};
