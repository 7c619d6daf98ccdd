/**
 * The one error for invalid forecast or scheduling input. `field` is a dotted path to
 * the offending value (for example `groups[3].endOfLife`) so a form or an API error
 * body can put the message beside it.
 */
export class ForecastInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'ForecastInputError';
    this.field = field;
  }
}
