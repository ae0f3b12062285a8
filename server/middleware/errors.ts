import type { ErrorRequestHandler, RequestHandler } from "express";
import { MulterError } from "multer";
import { ZodError, type z } from "zod";
import type { ApiErrorBody } from "../../shared/schemas/errors";

export class AppError extends Error {
  constructor(
    readonly code: string,
    message: string,
    readonly status: number,
    readonly fields?: Record<string, string[]>,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const notFound = (what = "That") => new AppError("not_found", `${what} was not found.`, 404);

export function fieldsFromZod(error: ZodError | z.core.$ZodError): Record<string, string[]> {
  // Keys come from the caller ("constructor", "__proto__", "toString"…): a map with no
  // prototype, so no key can find an inherited property instead of its own list (issue 12).
  const fields: Record<string, string[]> = Object.create(null);
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    if (issue.code === "unrecognized_keys") {
      for (const k of issue.keys) (fields[[...issue.path, k].join(".")] ??= []).push("is not a known field");
      continue;
    }
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

function body(code: string, message: string, fields?: Record<string, string[]>): ApiErrorBody {
  return { error: fields ? { code, message, fields } : { code, message } };
}

// body-parser errors carry a `type`; these are all the caller's mistake.
const bodyParserErrors: Record<string, [number, string, string]> = {
  "entity.parse.failed": [400, "malformed_json", "The request body is not valid JSON."],
  "entity.too.large": [413, "too_large", "The request body is too large."],
  "encoding.unsupported": [415, "unsupported_encoding", "That content encoding is not supported."],
  "charset.unsupported": [415, "unsupported_charset", "That character set is not supported."],
  "request.aborted": [400, "aborted", "The request was cut short."],
  "request.size.invalid": [400, "bad_length", "The request body does not match its length."],
  "stream.encoding.set": [400, "bad_request", "The request could not be read."],
  "entity.verify.failed": [400, "bad_request", "The request could not be read."],
  "encoding.invalid": [400, "invalid_utf8", "The request body is not valid UTF-8."],
};

/**
 * express.json's `verify` hook: refuse bytes that are not UTF-8 instead of letting them become
 * U+FFFD replacement characters in a member's name (RFC 8259 §8.1: JSON text is UTF-8).
 */
export function refuseInvalidUtf8(_req: unknown, _res: unknown, buf: Buffer) {
  try {
    new TextDecoder("utf-8", { fatal: true }).decode(buf);
  } catch {
    throw Object.assign(new Error("The request body is not valid UTF-8."), { status: 400, type: "encoding.invalid" });
  }
}

/**
 * Multipart parse errors from busboy ("Unexpected end of form", "Boundary not found",
 * "Malformed part header"…) are plain Errors without a status: the caller's mistake, not ours.
 * Wraps a multer middleware so they become 400s (multer has already removed any temp file).
 */
export function multipartErrorsAre400(mw: RequestHandler): RequestHandler {
  return (req, res, next) => {
    mw(req, res, (err?: unknown) => {
      if (!err || err instanceof MulterError || err instanceof AppError) return next(err);
      const status = (err as { status?: unknown }).status;
      if (typeof status === "number" && status < 500) return next(err);
      next(new AppError("malformed_upload", "The upload could not be read: send it as multipart/form-data.", 400));
    });
  };
}

const multerErrors: Partial<Record<MulterError["code"], [number, string]>> = {
  LIMIT_FILE_SIZE: [413, "The file is too large."],
  LIMIT_FILE_COUNT: [400, "Send one file at a time."],
  LIMIT_UNEXPECTED_FILE: [400, "Unexpected file field."],
  LIMIT_FIELD_COUNT: [400, "Too many form fields."],
  LIMIT_PART_COUNT: [400, "Too many form parts."],
  LIMIT_FIELD_VALUE: [413, "A form field is too long."],
  LIMIT_FIELD_KEY: [400, "A form field name is too long."],
};

export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json(body("not_found", `No such API route: ${req.method} ${req.path}`));
};

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) return;
  if (err instanceof AppError) {
    res.status(err.status).json(body(err.code, err.message, err.fields));
    return;
  }
  if (err instanceof ZodError) {
    res.status(400).json(body("invalid_request", "Some fields are not right.", fieldsFromZod(err)));
    return;
  }
  if (err instanceof MulterError) {
    const [status, message] = multerErrors[err.code] ?? [400, "The upload could not be read."];
    res.status(status).json(body(err.code.toLowerCase(), message));
    return;
  }
  const type = typeof err?.type === "string" ? err.type : undefined;
  if (type && bodyParserErrors[type]) {
    const [status, code, message] = bodyParserErrors[type];
    res.status(status).json(body(code, message));
    return;
  }
  if (typeof err?.status === "number" && err.status >= 400 && err.status < 500) {
    res.status(err.status).json(body("bad_request", err.expose ? String(err.message) : "Bad request."));
    return;
  }
  req.log?.error({ err }, "unhandled error");
  res.status(500).json(body("server_error", "Something went wrong on our side. Please try again."));
};
