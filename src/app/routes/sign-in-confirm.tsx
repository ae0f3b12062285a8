import { useSearchParams } from "react-router";
import { Button, ButtonLink } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { Notice } from "../../components/ui/notice";
import { DocumentTitle } from "../../components/ui/page-header";
import { safeAuthCallbackUrl } from "../../lib/safe-redirect";

/**
 * Where a sign-in link from the mail lands. Mail scanners open links, which would use up a
 * one-time token, so the token is only spent when a person presses the button.
 */
export default function ConfirmSignInPage() {
  const [params] = useSearchParams();
  const target = safeAuthCallbackUrl(params.get("next"));

  return (
    <Card className="mx-auto max-w-xl space-y-4">
      <DocumentTitle title="Confirm sign-in" />
      <h1 className="text-3xl font-bold">One step left</h1>
      {target ? (
        <>
          <p className="text-lg text-ink-soft">
            Press the button to finish signing in. The link in your mail works once, so this page waits for you rather
            than signing in on its own.
          </p>
          <Button onClick={() => window.location.assign(target)} className="w-full sm:w-auto">
            Sign in to Blendwell
          </Button>
        </>
      ) : (
        <>
          <Notice tone="error" title="This sign-in link is not complete">
            <p>
              The link is damaged or does not come from Blendwell. Copy the whole link from the mail, or ask for a new
              one.
            </p>
          </Notice>
          <ButtonLink to="/sign-in" variant="secondary">
            Ask for a new link
          </ButtonLink>
        </>
      )}
    </Card>
  );
}
