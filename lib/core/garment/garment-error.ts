// Input a garment cannot be built, placed or read from; the message names the field and, for a
// stitch, the place the way a knitter reads it: row from the bottom, stitch from the right.
export class GarmentError extends Error {
  /** the input field the message is about, e.g. `charts[1].chart` */
  readonly field: string;
  constructor(field: string, message: string) {
    super(message.startsWith(field) ? message : `${field}: ${message}`);
    this.name = "GarmentError";
    this.field = field;
  }
}
