// Input a colour plan or darning route cannot be made from; the message names the field to fix.
export class ColourworkError extends Error {
  /** the input field the message is about, e.g. `options.knit[1]` */
  readonly field: string;
  constructor(field: string, message: string) {
    super(message.startsWith(field) ? message : `${field}: ${message}`);
    this.name = "ColourworkError";
    this.field = field;
  }
}
