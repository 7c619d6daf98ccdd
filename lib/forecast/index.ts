/**
 * Tidewarden forecast and scheduling: pure, synchronous, dates as JS Date in UTC,
 * masses in kg, currents in A.
 *
 * - forecast-group      forecastGroup: one installed group's depletion on its demand profile,
 *                       surveys scaling the profile, renewBy and endOfLife with their bands
 * - demand-profile      the linear demand profile and the charge it delivers (closed forms)
 * - labels              the words for the forecast's dates ('Renew by', 'End of life')
 * - propose-renewals    proposeRenewals / proposeRenewalsForFleet: the docking that renews each group
 *                       (scheduled on its renewBy date)
 * - propose-dockings    proposeNextDockings: future dockings under class practice
 * - outlook             assetOutlook (fleet overview) and massDueKg (anode mass per docking)
 * - dates               UTC calendar-month arithmetic and 8760-h years
 * - errors              ForecastInputError, with `field`
 * The rules are documented at the top of each module.
 */
export { ForecastInputError } from './errors';
export {
  HOURS_PER_YEAR,
  MS_PER_DAY,
  MS_PER_YEAR,
  addMonthsUTC,
  addYears8760,
  dayNumberUTC,
  startOfDayUTC,
  yearsBetween,
} from './dates';
export { chargeAYears, currentAtA, meanCurrentA, yearsToCharge, type DemandProfile } from './demand-profile';
export { FORECAST_DATE_LABELS, forecastDateWords, type ForecastDateKind } from '@/lib/labels/forecast';
export {
  BAND_FRACTION,
  DEFAULT_RENEWAL_THRESHOLD_REMAINING,
  MAX_FORECAST_YEARS,
  MAX_SERIES_POINTS,
  MIN_SURVEY_BASELINE_YEARS,
  READING_UNCERTAINTY,
  forecastGroup,
  type ForecastBasis,
  type GroupForecast,
  type GroupForecastInput,
  type RemainingPoint,
  type SurveyReading,
} from './forecast-group';
export {
  DEFAULT_MARGIN_MONTHS,
  DEFAULT_TYPICAL_INTERVAL_MONTHS,
  proposeRenewals,
  proposeRenewalsForFleet,
  type DockingInput,
  type DockingStatus,
  type FleetAssetInput,
  type FleetAssetProposals,
  type ProposeRenewalsInput,
  type RenewalGroupInput,
  type RenewalOptions,
  type RenewalProposal,
  type RenewalStatus,
} from './propose-renewals';
export {
  DEFAULT_DOCKING_INTERVAL_MONTHS,
  MAX_DOCKING_GAP_DAYS,
  MAX_DOCKING_INTERVAL_MONTHS,
  RENEWAL_SURVEY_CYCLE_MONTHS,
  proposeNextDockings,
  type DockingKind,
  type ProposeNextDockingsInput,
  type ProposedDocking,
} from './propose-dockings';
export { assetOutlook, massDueKg, type AssetOutlook, type AssetOutlookInput, type GroupStatusSummary, type MassDue } from './outlook';
