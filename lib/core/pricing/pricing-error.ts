// The one error type pricing throws for input a person must correct; the message names the field,
// and `field` (when known) is its path, e.g. "materials[1].taxCategory", for forms to place it.
export class PricingInputError extends Error {
  /** the quote field the message belongs on, when there is one (the builder shows it there) */
  readonly field?: string;
  constructor(message: string, field?: string) {
    super(message);
    if (field) this.field = field;
    this.name = "PricingInputError";
  }
}
