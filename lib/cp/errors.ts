/**
 * The single error type for invalid input. `field` is a dotted path to the offending
 * value (for example `surfaces[2].areaM2`) so a form can put the message beside it.
 */
export class CpInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'CpInputError';
    this.field = field;
  }
}
