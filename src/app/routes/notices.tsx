import { Button } from "../../components/ui/button";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { RequireRole } from "../../features/accounts/components/require-role";
import { useNotices } from "../../features/notices/api/get-notices";
import { useMarkNoticesRead } from "../../features/notices/api/mark-notices-read";
import { NoticeList } from "../../features/notices/components/notice-list";
import { errorMessage } from "../../lib/api-client";
import { plural } from "../../lib/format";

function Notices() {
  const notices = useNotices();
  const markRead = useMarkNoticesRead();
  const unread = notices.data?.items.filter((n) => n.readAt === null).length ?? 0;

  return (
    <>
      <PageHeader
        documentTitle={unread ? `Notices (${unread} unread)` : "Notices"}
        title="Notices"
        intro="What moderators decided about your strips and reports, newest first. The same notices are sent by e-mail."
        actions={
          <Button variant="secondary" disabled={unread === 0} busy={markRead.isPending} busyLabel="Marking…" onClick={() => markRead.mutate()}>
            Mark all read
          </Button>
        }
      />
      {notices.isPending ? (
        <Loading label="Loading your notices…" />
      ) : notices.isError ? (
        <Notice tone="error" title="Your notices could not be loaded" live>
          <p>{errorMessage(notices.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void notices.refetch()}>
            Try again
          </Button>
        </Notice>
      ) : notices.data.items.length === 0 ? (
        <Notice title="No notices yet">
          <p>When a moderator decides about one of your strips or a strip you reported, you will find it here.</p>
        </Notice>
      ) : (
        <div className="flex flex-col gap-4">
          <p className="text-ink-soft" aria-live="polite">
            {unread ? `${plural(unread, "unread notice")} of ${notices.data.items.length}.` : "All read."}
          </p>
          <NoticeList notices={notices.data.items} />
        </div>
      )}
    </>
  );
}

export default function NoticesPage() {
  return <RequireRole>{() => <Notices />}</RequireRole>;
}
