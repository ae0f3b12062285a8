export type NoStripCode = "no_ink" | "too_small" | "not_strip_shaped";

const MESSAGES: Record<NoStripCode, string> = {
  no_ink:
    "We could not find a blended strip in this photo. Lay the strip on plain white paper, fill most of the frame with it and take the photo in even light.",
  too_small:
    "The strip is too small in this photo for us to read its colours. Move closer so the strip fills most of the frame.",
  not_strip_shaped:
    "We found colour in this photo but not a strip shape. Photograph one strip at a time, lying flat on plain white paper.",
};

/** The photo was readable but holds no strip we can analyse. `message` is meant for the member. */
export class NoStripError extends Error {
  readonly code: NoStripCode;
  constructor(code: NoStripCode) {
    super(MESSAGES[code]);
    this.name = "NoStripError";
    this.code = code;
  }
}
