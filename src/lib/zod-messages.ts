import { z } from "zod";

/**
 * Friendly wording for zod's built-in checks that the shared schemas leave unworded (for example
 * the L*a*b* ranges). Schema-level messages still win. Messages read after the field's label:
 * "L* must be at most 100".
 */
export function friendlyIssueMessage(issue: z.core.$ZodRawIssue): string | undefined {
  switch (issue.code) {
    case "invalid_type":
      if (issue.input === undefined || issue.input === "") return "is required";
      if (issue.expected === "number") return "must be a number";
      return undefined;
    case "too_small":
      if (issue.origin === "number") return `must be at least ${String(issue.minimum)}`;
      if (issue.origin === "string")
        return Number(issue.minimum) <= 1 ? "is required" : `needs at least ${String(issue.minimum)} characters`;
      return undefined;
    case "too_big":
      if (issue.origin === "number") return `must be at most ${String(issue.maximum)}`;
      if (issue.origin === "string") return `must be at most ${String(issue.maximum)} characters`;
      return undefined;
    case "invalid_format":
      if (issue.format === "email") return "must be an e-mail address";
      return undefined;
    case "invalid_value":
      return `must be one of: ${issue.values.map(String).join(", ")}`;
    default:
      return undefined;
  }
}

export function installFriendlyZodMessages(): void {
  z.config({ customError: (issue) => friendlyIssueMessage(issue) });
}
