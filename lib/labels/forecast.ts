/**
 * Words for the forecast's dates: the one place the screens and the scheduler's sentences
 * take them from (safe for client code).
 */
export const FORECAST_DATE_LABELS = {
  /** GroupForecast.renewBy: the higher of 1 - u and the renewal threshold is reached. */
  renewBy: 'Renew by',
  /**
   * GroupForecast.endOfLife: the utilisation factor u is used up (1 - u remains). One name everywhere (DNV-RP-B401
   * speaks of the anode's end of life); never "reaches its utilisation factor".
   */
  endOfLife: 'End of life',
  /** The early to late forecast of the renew-by date (a faster and a slower wear rate). */
  band: 'Renew between (earliest – latest)',
} as const;

export type ForecastDateKind = keyof typeof FORECAST_DATE_LABELS;

/** The label inside a sentence ('renew by', 'end of life'). */
export function forecastDateWords(kind: ForecastDateKind): string {
  const label: string = FORECAST_DATE_LABELS[kind];
  return label.charAt(0).toLowerCase() + label.slice(1);
}
