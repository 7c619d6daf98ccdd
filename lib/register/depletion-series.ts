/** One group's depletion curve as the asset page's chart draws it (net mass in kg over time). */
export interface DepletionSeries {
  label: string;
  points: { date: Date; kg: number }[];
  surveys: { date: Date; kg: number }[];
  /** Net mass at which the group reaches its utilisation factor, kg. */
  endKg: number;
  endOfLife: Date | null;
  /** Net mass at which the group is to be renewed (the renewal threshold, or endKg if higher), kg. */
  renewKg?: number;
  /** The forecast's renew-by date: the date renewals are scheduled on. */
  renewBy?: Date | null;
}
