// A sizing input that cannot make a garment; the message is written for the person who typed it.
export class SizingError extends Error {
  /** the input field the message is about, e.g. `measurements.headCircumferenceCm` */
  readonly field: string;
  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = "SizingError";
    this.field = field;
  }
}
