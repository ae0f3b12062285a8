import { QueryClientProvider } from "@tanstack/react-query";
import { useState, type ReactNode } from "react";
import { toast, Toaster } from "../components/ui/toast";
import { errorMessage } from "../lib/api-client";
import { createQueryClient } from "../lib/query-client";

export function Providers({ children }: { children: ReactNode }) {
  // Any error a component has not promised to show becomes a toast, so none goes unseen.
  const [queryClient] = useState(() => createQueryClient({ onUnhandledError: (error) => toast.error(errorMessage(error)) }));
  return (
    <QueryClientProvider client={queryClient}>
      {children}
      <Toaster />
    </QueryClientProvider>
  );
}
