// Input a chart cannot be made from a photo with; the message names the field to fix.
export class PhotoError extends Error {
  /** the input field the message is about, e.g. `crop.width` or `colours` */
  readonly field: string;
  constructor(field: string, message: string) {
    super(message.startsWith(field) ? message : `${field}: ${message}`);
    this.name = "PhotoError";
    this.field = field;
  }
}
