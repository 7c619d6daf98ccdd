/**
 * The one error for invalid input in the pure libraries (lib/cp, lib/forecast, lib/anode-list): `field`
 * is a dotted path to the offending value (for example `surfaces[2].areaM2`) so a form or an API error
 * body can put the message beside it. The server's error mapper turns every one into a 422.
 */
export class InputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'InputError';
    this.field = field;
  }
}
