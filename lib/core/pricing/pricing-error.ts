// The one error type pricing throws for input a person must correct; the message names the field.
export class PricingInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "PricingInputError";
  }
}
