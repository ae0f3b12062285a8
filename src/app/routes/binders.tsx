import { PageHeader } from "../../components/ui/page-header";
import { RequireRole } from "../../features/accounts/components/require-role";
import { MyBinders } from "../../features/binders/components/my-binders";

export default function BindersPage() {
  return (
    <RequireRole>
      {() => (
        <>
          <PageHeader
            documentTitle="Your binders"
            eyebrow="Your binders"
            title="Binders"
            intro="Strips you keep for later, in the order you choose. Private binders are yours alone; public ones have a link you can share."
          />
          <MyBinders />
        </>
      )}
    </RequireRole>
  );
}
