/**
 * Tidewarden cathodic-protection core: pure, synchronous, SI units inside.
 * Basis: DNV-RP-B401 (2010, amended 2011) with MIL-HDBK-1004/10 for harbour values
 * (see `basis` and each result's `basis` list).
 *
 * Modules
 * - errors                  CpInputError: the one error for invalid input, with `field`
 * - basis                   pinned editions; BASIS_ENTRIES for the calculation note
 * - types                   shared types (shapes, currents, warnings)
 * - tables/*                reference data with source and flag: current density,
 *                           coating constants, alloys, utilisation, resistivity,
 *                           potential limits, harbour, hull, reference electrodes
 * - lookups                 currentDensityFor, coatingConstantsFor, resistivityFor,
 *                           climateFromTemperature, depthBandFromDepth, utilisationFactorFor
 * - coating-breakdown       fc = a + b*t at initial, mean, final
 * - current-demand          Ic = Ac*fc*ic for one surface
 * - anode-mass              net mass, remaining life, consumption-rate helpers
 * - anode-shape             shape validation
 * - anode-resistance        Dwight / short slender / long flush / McCoy, stand-off rules
 * - end-of-life             the anode's shape when consumed to its utilisation factor
 * - anode-output            Ia = (Ec - Ea)/Ra, driving voltage
 * - wetted-surface          Denny-Mumford and Holtrop-Mennen hull areas
 * - potentials              reference electrode conversion, chloride correction of
 *                           Ag/AgCl/seawater readings (Nernst)
 * - practical-salinity      PSS-78 at zero pressure: salinity <-> conductivity, resistivity
 * - water-type              fresh / brackish / seawater from salinity, chlorinity
 * - physical-constants      SI 2019 defining constants, Faraday and gas constants
 * - theoretical-capacity    Faraday's-law capacity of each anode alloy's metal
 * - plausibility            refusals (capacity, anode potential) and unit-slip warnings
 * - design-input            design input types and validation
 * - design-checks           invalid combinations (throw) and warnings
 * - design-anode-system     the full sizing
 * - distribute-anodes       share a count over surfaces by demand
 * - anode-model, anode-from-model, builtin-anode-models   catalogue
 * - compare-options         one job with several models side by side
 * - impressed-current       output an impressed-current system must deliver
 * - units                   US-customary conversions for handbook checks
 * - numeric                 ceilCount (float-safe), HOURS_PER_YEAR
 *
 * Decisions (each also documented where it is made)
 * - Stand-off: not stated = at least 0.30 m (formula as is); 0.15-0.30 m x 1.3; below
 *   0.15 m the slender anode is treated as a flush plate as wide as its diameter, never
 *   below the 1.3-corrected value (warning 'standoff-treated-as-flush').
 * - Long flush needs L >= 4 W (and 4 T when given); else McCoy on L x W (warning).
 * - End of life: slender 0.9 L, remaining mass m(1-u) round the core (core negligible
 *   unless coreRadiusM); flush plates and bracelets by uniform recession of face and
 *   edges (thickness implied by the mass when not given), or, without plan dimensions,
 *   area x (1-u)^(2/3). At least 2 % of the mass is assumed left (finite at u = 1), and
 *   the final resistance is never taken below the initial.
 * - Potentials vs SHE: Ag/AgCl/seawater +0.25, CSE +0.30 (50 mV rule; strictly +0.316),
 *   SCE +0.241, Ag/AgCl sat. KCl +0.197, zinc -0.80. The Ag/AgCl/seawater value holds at
 *   35 PSU; a salinity given with a reading moves it by -0.05916 log10(S/35) V.
 * - Water: PSS-78 temperature taken as given (IPTS-68 vs ITS-90 under 0.01 C); water type
 *   by the Venice system (fresh < 0.5 <= brackish < 30 <= seawater, PSU).
 * - Plausibility: capacity above Faraday's-law value and anode potential outside -1.8 to
 *   -0.7 V throw; resistivity unfit for the water and current densities above 1 A/m2 warn.
 * - Counts: ceil after snapping float noise within 1e-9 (relative) to the whole number.
 * - Distribution follows the demand of the governing criterion (mean for mass).
 * - A total mean demand below 1 nA, or a result that would overflow, is invalid input.
 */
export { CpInputError } from './errors';
export { basis, BASIS_ENTRIES, DNV_RP_B401 } from './basis';
export type * from './types';

export * from './tables/current-density';
export * from './tables/coating-constants';
export * from './tables/alloys';
export * from './tables/utilisation';
export * from './tables/resistivity';
export * from './tables/potential-limits';
export * from './tables/harbour';
export * from './tables/hull';
export * from './tables/metallic-coatings';
export * from './tables/reference-electrodes';

export {
  currentDensityFor,
  coatingConstantsFor,
  resistivityFor,
  climateFromTemperature,
  depthBandFromDepth,
  utilisationFactorFor,
  utilisationCaseOf,
  CLIMATES,
  DEPTH_BANDS,
} from './lookups';
export { coatingBreakdown, type CoatingBreakdownInput } from './coating-breakdown';
export { surfaceCurrentDemand, type SurfaceDemandInput } from './current-demand';
export {
  netAnodeMassKg,
  remainingLifeYears,
  consumptionRateKgPerAYear,
  capacityFromConsumptionRate,
  massFromConsumptionRate,
  type NetMassInput,
} from './anode-mass';
export {
  anodeResistanceOhm,
  anodeResistanceDetail,
  modifiedDwightOhm,
  shortSlenderOhm,
  longFlushOhm,
  mcCoyOhm,
  equivalentRadiusM,
  FULL_STANDOFF_M,
  MIN_CORRECTED_STANDOFF_M,
  STANDOFF_FACTOR,
  type AnodeResistanceInput,
  type ResistanceDetail,
  type ResistanceTreatment,
} from './anode-resistance';
export { endOfLifeShape, END_OF_LIFE_LENGTH_FACTOR, MIN_REMAINING_FRACTION, type EndOfLifeInput } from './end-of-life';
export { anodeCurrentOutputA, type AnodeOutputInput } from './anode-output';
export {
  wettedSurfaceDennyMumford,
  wettedSurfaceHoltropMennen,
  type HullParticulars,
  type HoltropMennenParticulars,
} from './wetted-surface';
export {
  convertPotential,
  nernstSlopeV,
  agAgClSeawaterShiftV,
  AG_AGCL_SEAWATER_CALIBRATION_PSU,
  AG_AGCL_SEAWATER_SALINITY_RANGE_PSU,
  CHLORIDE_CORRECTION_TEMPERATURE_C,
  type ConvertPotentialInput,
} from './potentials';
export {
  seawaterConductivitySPerM,
  seawaterResistivityOhmM,
  practicalSalinity,
  PSS78_REFERENCE_CONDUCTIVITY_S_PER_M,
  PSS78_SALINITY_RANGE_PSU,
  PSS78_TEMPERATURE_RANGE_C,
  type SeawaterStateInput,
  type PracticalSalinityInput,
} from './practical-salinity';
export { waterTypeFromSalinity, chlorinityGPerKg, WATER_TYPE_SALINITY_LIMITS_PSU, SALINITY_PER_CHLORINITY } from './water-type';
export {
  ELEMENTARY_CHARGE_C,
  AVOGADRO_PER_MOL,
  BOLTZMANN_J_PER_K,
  FARADAY_C_PER_MOL,
  GAS_CONSTANT_J_PER_MOL_K,
  ZERO_CELSIUS_K,
  SECONDS_PER_HOUR,
} from './physical-constants';
export { theoreticalCapacityAhPerKg, ANODE_METALS, type AnodeMetal } from './theoretical-capacity';
export {
  ANODE_POTENTIAL_RANGE_V,
  SEAWATER_RESISTIVITY_RANGE_OHM_M,
  FRESH_WATER_MIN_RESISTIVITY_OHM_M,
  MAX_PLAUSIBLE_CURRENT_DENSITY_A_PER_M2,
} from './plausibility';
export {
  DEFAULT_PROTECTIVE_POTENTIAL_V,
  type DesignInput,
  type DesignJob,
  type DesignAnode,
  type DesignSurface,
  type DesignEnvironment,
} from './design-input';
export { protectionCriterionV, ALUMINIUM_PASSIVATION_CHLORIDE_PPM, SEAWATER_RESISTIVITY_CEILING_OHM_M } from './design-checks';
export {
  designAnodeSystem,
  type DesignResult,
  type GoverningCriterion,
  type PerAnodeResult,
  type SurfaceResult,
} from './design-anode-system';
export { distributeAnodes, type DistributionInput, type Distribution, type DistributionRow } from './distribute-anodes';
export type { AnodeModel, AnodeMounting, AnodeDimensions } from './anode-model';
export { anodeFromModel } from './anode-from-model';
export { BUILTIN_ANODE_MODELS, builtinAnodeModel } from './builtin-anode-models';
export { compareOptions, type CompareOptionsInput, type OptionRow, type OptionCost } from './compare-options';
export {
  impressedCurrentSummary,
  IMPRESSED_CURRENT_MARGIN,
  IMPRESSED_CURRENT_RATING_STEP_A,
  type ImpressedCurrentInput,
  type ImpressedCurrentSummary,
} from './impressed-current';
export { ceilCount, HOURS_PER_YEAR } from './numeric';
export * from './units';
