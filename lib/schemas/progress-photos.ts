// Zod schemas for progress photos of a piece (one per work stage), shared by the form and the routes.
import { z } from "zod";
import { WORK_STAGES } from "./production";

/** A checkbox in a multipart form: "on"/"true"/"1" is yes, anything else (or missing) is no. */
const formFlag = z
  .union([z.string(), z.boolean(), z.null(), z.undefined()])
  .transform((v) => v === true || v === "on" || v === "true" || v === "1");

export const progressPhotoFieldsSchema = z.object({
  stage: z.enum(WORK_STAGES, { message: "Choose the stage the photo shows." }),
  shared: formFlag,
});
export type ProgressPhotoFields = z.output<typeof progressPhotoFieldsSchema>;

export const photoShareSchema = z.object({ shared: z.boolean({ message: "Say whether the client may see the photo." }) });

export interface ProgressPhoto {
  id: string;
  stage: string;
  shared: boolean;
  width: number;
  height: number;
  createdAt: string;
}
