import { queryOptions, useQuery } from "@tanstack/react-query";
import type { Upload } from "../../../../shared/schemas/uploads";
import { api } from "../../../lib/api-client";
import { uploadKeys } from "./keys";

/** How often an upload is asked about while its photo is being analysed. */
export const UPLOAD_POLL_MS = 1000;

export function getUpload(id: string, signal?: AbortSignal): Promise<Upload> {
  return api.get<Upload>(`/api/uploads/${id}`, { signal });
}

export const uploadQueryOptions = (id: string) =>
  queryOptions({
    queryKey: uploadKeys.detail(id),
    queryFn: ({ signal }) => getUpload(id, signal),
    staleTime: 0,
    refetchInterval: (query) => (query.state.data?.status === "processing" ? UPLOAD_POLL_MS : false),
    // Keep asking even if the member switches to another tab (or app) while waiting.
    refetchIntervalInBackground: true,
    meta: { errorsShownInline: true },
  });

export function useUpload(id: string | null) {
  return useQuery({ ...uploadQueryOptions(id ?? ""), enabled: id !== null });
}
