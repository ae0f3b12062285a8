import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { OutlineCorrection } from "../../../../shared/schemas/outlines";
import type { Upload } from "../../../../shared/schemas/uploads";
import { api } from "../../../lib/api-client";
import { uploadKeys } from "./keys";

/**
 * POST /api/uploads/:id/outline: read one strip again at the member's outline (stripIndex = the
 * count adds a strip; outline null removes one). Answers the upload as it now is.
 */
export function correctOutline(id: string, input: OutlineCorrection): Promise<Upload> {
  return api.post<Upload>(`/api/uploads/${id}/outline`, input);
}

export function useCorrectOutline(id: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: OutlineCorrection) => correctOutline(id, input),
    // The panel says what went wrong beside the photo.
    meta: { errorsShownInline: true },
    onSuccess: (upload) => queryClient.setQueryData<Upload>(uploadKeys.detail(id), upload),
  });
}
