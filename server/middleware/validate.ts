import type { RequestHandler } from "express";
import type { z } from "zod";
import { AppError, fieldsFromZod } from "./errors";

type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };

function parse(schema: z.ZodType, value: unknown, where: string) {
  const result = schema.safeParse(value);
  if (!result.success) {
    const message = where === "params" ? "That address is not valid." : "Some fields are not right.";
    throw new AppError("invalid_request", message, where === "params" ? 404 : 400, fieldsFromZod(result.error));
  }
  return result.data;
}

/** Parses body, query and params with the shared zod schemas and replaces them on `req`. */
export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    if (schemas.params) req.params = parse(schemas.params, req.params, "params") as typeof req.params;
    if (schemas.query) {
      // Express 5 makes req.query a getter; shadow it with the parsed value.
      Object.defineProperty(req, "query", { value: parse(schemas.query, req.query, "query"), writable: true });
    }
    if (schemas.body) {
      if (!req.is("application/json")) {
        throw new AppError("unsupported_media_type", "Send the request body as application/json.", 415);
      }
      req.body = parse(schemas.body, req.body, "body");
    }
    next();
  };
}
