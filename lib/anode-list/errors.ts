/**
 * The one error for invalid anode-list input. `field` is a dotted path to the offending
 * value (for example `renewals[3].quantity`) so a route handler can put the message beside it.
 */
export class AnodeListInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'AnodeListInputError';
    this.field = field;
  }
}
