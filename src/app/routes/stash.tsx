import { PageHeader } from "../../components/ui/page-header";
import { RequireRole } from "../../features/accounts/components/require-role";
import { MyStash } from "../../features/stash/components/my-stash";

export default function StashPage() {
  return (
    <RequireRole>
      {() => (
        <>
          <PageHeader
            documentTitle="Your stash"
            eyebrow="Your stash"
            title="The inks you own"
            intro="Keep your stash here so you never buy an ink twice, see which inks are running low, and find strips you can blend with what you have."
          />
          <MyStash />
        </>
      )}
    </RequireRole>
  );
}
