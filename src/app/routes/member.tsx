import { useParams } from "react-router";
import { Button, ButtonLink } from "../../components/ui/button";
import { Badge } from "../../components/ui/badge";
import { Loading } from "../../components/ui/loading";
import { Notice } from "../../components/ui/notice";
import { DocumentTitle } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { MemberBinders } from "../../features/binders/components/member-binders";
import { MemberModerationPanel } from "../../features/review/components/member-moderation-panel";
import { canModerate } from "../../lib/roles";
import { useMember } from "../../features/strips/api/get-member";
import { StripList } from "../../features/strips/components/strip-list";
import { errorMessage, isApiError } from "../../lib/api-client";
import { formatDate, plural } from "../../lib/format";
import NotFoundPage from "./not-found";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default function MemberPage() {
  const raw = useParams().id;
  if (!raw || !UUID.test(raw)) return <NotFoundPage what="member" />;
  return <MemberDetail key={raw} id={raw} />;
}

function MemberDetail({ id }: { id: string }) {
  const member = useMember(id);
  const { data: me } = useMe();

  if (member.isPending) return <Loading label="Loading the member…" />;
  if (member.isError) {
    if (isApiError(member.error) && member.error.status === 404) return <NotFoundPage what="member" />;
    return (
      <>
        <DocumentTitle title="Member" />
        <Notice tone="error" title="This member could not be loaded" live>
          <p>{errorMessage(member.error)}</p>
          <Button variant="secondary" className="mt-3" onClick={() => void member.refetch()}>
            Try again
          </Button>
        </Notice>
      </>
    );
  }

  const data = member.data;
  const own = me?.id === data.id;
  const published = data.strips.filter((s) => s.status === "published");
  const unpublished = data.strips.filter((s) => s.status !== "published");

  return (
    <div className="flex flex-col gap-10">
      <DocumentTitle title={own ? "Your strips" : data.name} />
      <header className="flex flex-col gap-4 border-b border-rule pb-6 sm:flex-row sm:items-end sm:justify-between">
        <div className="space-y-2">
          {own && <p className="text-sm font-bold tracking-wide text-ink-muted uppercase">Your strips</p>}
          <h1 className="text-3xl leading-tight font-bold sm:text-4xl">{data.name}</h1>
          <p className="flex flex-wrap items-center gap-x-4 gap-y-1 text-ink-soft">
            {data.standing === "trusted" && <Badge tone="accent">Trusted member</Badge>}
            <span>Member since {formatDate(data.joinedAt)}</span>
            <span>{plural(published.length, "published strip")}</span>
          </p>
          {data.bio && <p className="max-w-prose whitespace-pre-line text-ink-soft">{data.bio}</p>}
        </div>
        {own && (
          <div className="flex flex-wrap gap-2">
            <ButtonLink to="/post">Post a strip</ButtonLink>
            <ButtonLink to="/account" variant="secondary">
              Edit your profile
            </ButtonLink>
          </div>
        )}
      </header>

      {me && canModerate(me.role) && !own && (
        <MemberModerationPanel memberId={data.id} memberName={data.name} viewerRole={me.role} />
      )}

      {unpublished.length > 0 && (
        <section aria-labelledby="unpublished-title" className="flex flex-col gap-4">
          <div className="space-y-1">
            <h2 id="unpublished-title" className="text-2xl font-bold">
              {own ? "Not published yet" : "Not published"}
            </h2>
            <p className="text-ink-soft">
              {own
                ? "Only you and the moderators can see these. Open one to see what happens next or to edit it."
                : "Shown to you as a moderator."}
            </p>
          </div>
          <StripList strips={unpublished} label="Strips not published" showStatus hideAuthor />
        </section>
      )}

      <section aria-labelledby="published-title" className="flex flex-col gap-4">
        <h2 id="published-title" className="text-2xl font-bold">
          {own ? "Published" : "Strips"}
        </h2>
        {published.length === 0 ? (
          <p className="text-ink-soft">{own ? "None of your strips is published yet." : `${data.name} has not published a strip yet.`}</p>
        ) : (
          <StripList strips={published} label={`Strips by ${data.name}`} hideAuthor eagerCount={2} />
        )}
      </section>
      <MemberBinders memberId={data.id} />
    </div>
  );
}
