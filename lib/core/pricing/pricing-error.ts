// The one error type pricing throws for input a person must correct; the message names the field,
// and `field` (when known) is its path, e.g. "materials[1].taxCategory", for forms to place it.
export class PricingInputError extends Error {
  readonly field: string | undefined;
  constructor(message: string, field?: string) {
    super(message);
    this.name = "PricingInputError";
    this.field = field;
  }
}
