import { useMutation } from "@tanstack/react-query";
import type { z } from "zod";
import type { reportInput } from "../../../../shared/schemas/moderation";
import { api } from "../../../lib/api-client";

export type StripReport = z.output<typeof reportInput>;
export type ReportReceipt = { received: boolean; held: boolean };

/** POST /api/strips/:id/reports → 201. 409 already reported, 422 one's own strip, 403 suspended. */
export function reportStrip(stripId: number, report: StripReport): Promise<ReportReceipt> {
  return api.post<ReportReceipt>(`/api/strips/${stripId}/reports`, report);
}

export function useReportStrip(stripId: number) {
  return useMutation({
    mutationFn: (report: StripReport) => reportStrip(stripId, report),
    meta: { errorsShownInline: true },
  });
}
