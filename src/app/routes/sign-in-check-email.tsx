import { useLocation } from "react-router";
import { ButtonLink } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { DocumentTitle } from "../../components/ui/page-header";

export default function CheckEmailPage() {
  const state = useLocation().state as { email?: unknown } | null;
  const email = typeof state?.email === "string" ? state.email : null;
  return (
    <Card className="mx-auto max-w-xl space-y-4 text-center">
      <DocumentTitle title="Check your e-mail" />
      <div aria-hidden="true" className="blend-ornament mx-auto h-2 w-24 rounded-full" />
      <h1 className="text-3xl font-bold">Check your e-mail</h1>
      <p className="text-lg text-ink-soft">
        We sent a sign-in link{email ? (
          <>
            {" "}
            to <strong className="break-all text-ink">{email}</strong>
          </>
        ) : null}
        . It works <strong className="text-ink">once</strong>, for <strong className="text-ink">10 minutes</strong>.
      </p>
      <p className="text-ink-soft">
        Open it on this device, then press the button on the page it opens. Nothing arrived? Look in the spam folder, or
        ask for a new link.
      </p>
      <ButtonLink to="/sign-in" variant="secondary">
        Back to sign-in
      </ButtonLink>
    </Card>
  );
}
