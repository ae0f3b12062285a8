import type { ApiErrorBody } from "../../shared/schemas/errors";

/** Any failed call to our server: the body's `{error:{code,message,fields?}}`, or a stand-in for it. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields?: Record<string, string[]>;

  constructor(status: number, code: string, message: string, fields?: Record<string, string[]>) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

/** A message a person can act on, for anything a query or mutation may throw. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error && error.message) return error.message;
  return "Something went wrong. Please try again.";
}

type QueryValue = string | number | boolean | null | undefined;

export type RequestOptions = {
  method?: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  /** Plain objects are sent as JSON; FormData and URLSearchParams as they are. */
  body?: unknown;
  /** An array value repeats the parameter (`?ink=1&ink=2`). */
  query?: Record<string, QueryValue | readonly QueryValue[]>;
  headers?: Record<string, string>;
  signal?: AbortSignal;
};

const fallbackMessages: Record<number, string> = {
  400: "The request was not accepted. Please check what you entered.",
  401: "Please sign in first.",
  403: "You are not allowed to do that.",
  404: "That could not be found.",
  409: "That clashes with something that already exists.",
  413: "That is too large to send.",
  415: "That kind of file is not accepted.",
  422: "Some of what you sent could not be used.",
  429: "Too many tries. Please wait a moment and try again.",
};

function fallbackError(status: number): ApiError {
  const message =
    fallbackMessages[status] ??
    (status >= 500
      ? "Something went wrong on our side. Please try again in a moment."
      : `The request failed (${status}).`);
  return new ApiError(status, `http_${status}`, message);
}

/** The ApiError for a failed answer: the server's own `{error}` body when it sent one. */
export function apiErrorFrom(status: number, data: unknown): ApiError {
  if (isErrorBody(data)) {
    const { code, message, fields } = data.error;
    return new ApiError(status, code, message, fields);
  }
  return fallbackError(status);
}

function isErrorBody(value: unknown): value is ApiErrorBody {
  if (typeof value !== "object" || value === null || !("error" in value)) return false;
  const e = (value as { error: unknown }).error;
  return (
    typeof e === "object" &&
    e !== null &&
    typeof (e as { message?: unknown }).message === "string" &&
    typeof (e as { code?: unknown }).code === "string"
  );
}

function buildUrl(path: string, query?: RequestOptions["query"]): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    for (const one of Array.isArray(value) ? value : [value]) {
      if (one === undefined || one === null || one === "") continue;
      params.append(key, String(one));
    }
  }
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

function encodeBody(body: unknown, headers: Headers): BodyInit | undefined {
  if (body === undefined) return undefined;
  if (body instanceof FormData || body instanceof URLSearchParams || body instanceof Blob) {
    // The browser sets the content type (with the multipart boundary) itself.
    return body;
  }
  headers.set("Content-Type", "application/json");
  return JSON.stringify(body);
}

async function readJson(response: Response): Promise<unknown> {
  const type = response.headers.get("Content-Type") ?? "";
  if (!type.includes("json")) return undefined;
  try {
    return await response.json();
  } catch {
    return undefined;
  }
}

/**
 * fetch for our own server: same-origin cookies, JSON in and out, and an ApiError for every
 * non-2xx answer (or a network failure) so callers never look at a Response.
 */
export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const headers = new Headers({ Accept: "application/json", ...options.headers });
  const init: RequestInit = {
    method: options.method ?? (options.body === undefined ? "GET" : "POST"),
    credentials: "same-origin",
    headers,
    body: encodeBody(options.body, headers),
    signal: options.signal,
  };

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), init);
  } catch (error) {
    if (error instanceof DOMException && error.name === "AbortError") throw error;
    throw new ApiError(0, "network", "Could not reach Blendwell. Check your connection and try again.");
  }

  if (response.status === 204 || response.status === 205) return undefined as T;
  const data = await readJson(response);

  if (!response.ok) throw apiErrorFrom(response.status, data);
  return data as T;
}

export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(path, { ...options, method: "GET" }),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(path, { ...options, method: "POST", body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(path, { ...options, method: "PATCH", body }),
  put: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(path, { ...options, method: "PUT", body }),
  delete: <T>(path: string, options?: Omit<RequestOptions, "method" | "body">) =>
    apiRequest<T>(path, { ...options, method: "DELETE" }),
};
