import { errorMessage, isApiError } from "../../lib/api-client";
import { UploadRefused } from "./api/upload-photo";

/** Words for an upload the server refused, with what to do next. */
export function refusalText(error: unknown): { title: string; body: string } {
  if (error instanceof UploadRefused && error.retryAfter !== undefined) {
    const wait = error.retryAfter >= 90 ? `${Math.ceil(error.retryAfter / 60)} minutes` : `${error.retryAfter} seconds`;
    return { title: "Blendwell is busy right now", body: `${error.message} You can try again in about ${wait}.` };
  }
  if (isApiError(error)) {
    const titles: Record<number, string> = {
      0: "The photo was not sent",
      400: "The photo could not be used",
      401: "Please sign in again",
      403: "You cannot post right now",
      413: "This photo is too large",
      415: "This file is not a photo we can read",
      429: "Too many photos at once",
      503: "Blendwell is busy right now",
    };
    // A bare 413 (from a proxy, say) carries no advice of its own.
    const advice = error.status === 413 && error.code.startsWith("http_") ? " Photos can be at most 20 MB." : "";
    return { title: titles[error.status] ?? "The photo could not be uploaded", body: error.message + advice };
  }
  return { title: "The photo could not be uploaded", body: errorMessage(error) };
}
