import { Link } from "react-router";
import { Button } from "../../components/ui/button";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { useDevMail } from "../../features/dev-mail/api/get-dev-mail";
import { MailList } from "../../features/dev-mail/components/mail-list";
import { errorMessage } from "../../lib/api-client";
import { plural } from "../../lib/format";

export default function DevMailPage() {
  const mail = useDevMail();
  return (
    <>
      <PageHeader
        documentTitle="Mail viewer"
        eyebrow="Development"
        title="Mail viewer"
        intro="Mail the server would have sent, caught by the local mail server. Newest first."
        actions={
          Array.isArray(mail.data) && (
            <Button variant="secondary" busy={mail.isFetching} busyLabel="Refreshing…" onClick={() => void mail.refetch()}>
              Refresh
            </Button>
          )
        }
      />
      {mail.isPending ? (
        <Loading label="Loading mail…" />
      ) : mail.isError ? (
        <Notice tone="error" title="The mail could not be loaded" live>
          <p>{errorMessage(mail.error)}</p>
        </Notice>
      ) : mail.data === "admins-only" ? (
        <Notice title="Only for the admin">
          <p>
            Mail holds sign-in links, so only an admin can read it. In the demo, sign in as{" "}
            <strong>admin@blendwell.test</strong> (see the README for the password), then come back.
          </p>
          <p className="mt-2">
            <Link to="/sign-in?next=%2Fdev%2Fmail" className="font-bold text-accent underline">
              Sign in
            </Link>
          </p>
        </Notice>
      ) : mail.data === null ? (
        <Notice title="Mail viewer is off (production)">
          <p>This server sends real mail, so there is nothing to show here.</p>
        </Notice>
      ) : mail.data.length === 0 ? (
        <Notice title="No mail yet">
          <p>Ask for a sign-in link and it will show up here.</p>
        </Notice>
      ) : (
        <>
          <p role="status" className="mb-4 text-ink-soft">
            {plural(mail.data.length, "message")}
          </p>
          <MailList messages={mail.data} />
        </>
      )}
    </>
  );
}
