import { Notice } from "../../../components/ui/notice";
import { DocumentTitle } from "../../../components/ui/page-header";

/** What a signed-in member sees on a moderators' page. (The server refuses them anyway.) */
export function ModeratorsOnly({ what }: { what: string }) {
  return (
    <>
      <DocumentTitle title="Moderators only" />
      <Notice tone="warning" title="Moderators only">
        <p>{what} is for moderators and admins.</p>
      </Notice>
    </>
  );
}
