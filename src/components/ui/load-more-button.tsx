import { Button } from "./button";

type LoadMoreButtonProps = { busy: boolean; onClick: () => void; label?: string; busyLabel?: string };

/** "Load more" under a paged list, centred, full width on a phone. */
export function LoadMoreButton({ busy, onClick, label = "Load more strips", busyLabel = "Loading more strips…" }: LoadMoreButtonProps) {
  return (
    <div className="flex justify-center">
      <Button variant="secondary" busy={busy} busyLabel={busyLabel} onClick={onClick} className="w-full sm:w-auto">
        {label}
      </Button>
    </div>
  );
}
