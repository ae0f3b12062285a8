export type ImageErrorCode =
  | "empty"
  | "too_large"
  | "too_many_pixels"
  | "unsupported_type"
  | "animated"
  | "corrupt"
  | "unreadable";

/** A photo we cannot take. `message` is written for the member who uploaded it. */
export class ImageError extends Error {
  readonly code: ImageErrorCode;
  constructor(code: ImageErrorCode, message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = "ImageError";
    this.code = code;
  }
}

export const ACCEPTED_WORDS = "a JPEG, PNG, WebP or HEIC photo";
