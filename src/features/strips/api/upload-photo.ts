import { useMutation } from "@tanstack/react-query";
import { apiErrorFrom, ApiError } from "../../../lib/api-client";

export type UploadAccepted = { id: string; status: "processing" };
export type UploadProgress = { loaded: number; total: number };

/** A refused upload. `retryAfter` (seconds) is set when the server is busy and said when to come back. */
export class UploadRefused extends ApiError {
  readonly retryAfter?: number;
  constructor(error: ApiError, retryAfter?: number) {
    super(error.status, error.code, error.message, error.fields);
    this.name = "UploadRefused";
    this.retryAfter = retryAfter;
  }
}

function parseRetryAfter(value: string | null): number | undefined {
  if (!value) return undefined;
  const seconds = Number(value);
  if (Number.isFinite(seconds) && seconds >= 0) return Math.ceil(seconds);
  const date = Date.parse(value);
  return Number.isNaN(date) ? undefined : Math.max(0, Math.ceil((date - Date.now()) / 1000));
}

function readJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

export type UploadPhotoInput = {
  file: File;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
};

/**
 * POST /api/uploads with the photo in the multipart field `image`. XMLHttpRequest rather than
 * fetch, because only XHR reports the bytes sent, which phones on slow connections need to see.
 */
export function uploadPhoto({ file, onProgress, signal }: UploadPhotoInput): Promise<UploadAccepted> {
  return new Promise((resolve, reject) => {
    if (signal?.aborted) {
      reject(new DOMException("The upload was cancelled.", "AbortError"));
      return;
    }
    const xhr = new XMLHttpRequest();
    xhr.open("POST", "/api/uploads");
    xhr.responseType = "text";
    xhr.withCredentials = true;
    xhr.setRequestHeader("Accept", "application/json");

    xhr.upload.onprogress = (e) => {
      onProgress?.({ loaded: e.loaded, total: e.lengthComputable ? e.total : file.size });
    };
    xhr.onload = () => {
      const data = readJson(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300 && data && typeof (data as UploadAccepted).id === "string") {
        resolve(data as UploadAccepted);
        return;
      }
      const error = xhr.status >= 200 && xhr.status < 300 ? apiErrorFrom(500, undefined) : apiErrorFrom(xhr.status, data);
      reject(new UploadRefused(error, parseRetryAfter(xhr.getResponseHeader("Retry-After"))));
    };
    xhr.onerror = () =>
      reject(new ApiError(0, "network", "The photo could not be sent. Check your connection and try again."));
    xhr.ontimeout = xhr.onerror;
    xhr.onabort = () => reject(new DOMException("The upload was cancelled.", "AbortError"));
    signal?.addEventListener("abort", () => xhr.abort(), { once: true });

    const body = new FormData();
    body.append("image", file, file.name || "strip-photo");
    xhr.send(body);
  });
}

export function useUploadPhoto() {
  return useMutation({
    mutationFn: uploadPhoto,
    // The post page shows upload problems beside the photo chooser.
    meta: { errorsShownInline: true },
  });
}
