import { useNavigate, useSearchParams } from "react-router";
import { ButtonLink } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { PasswordSignInForm } from "../../features/accounts/components/password-sign-in-form";
import { SignInLinkForm } from "../../features/accounts/components/sign-in-link-form";
import { signInErrorText } from "../../features/accounts/sign-in-errors";
import { safeInternalPath } from "../../lib/safe-redirect";

export default function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const { data: me } = useMe();
  const next = safeInternalPath(params.get("next")) ?? "/account";
  // Auth.js sends people back here with ?error= when its own pages would have been used.
  const error = params.get("error");
  const errorText = error ? signInErrorText(error) : null;

  return (
    <>
      <PageHeader
        documentTitle="Sign in"
        title="Sign in to Blendwell"
        intro="Use your password, or have a one-time link e-mailed to you."
      />
      {me && (
        <Notice tone="info" title={`You are signed in as ${me.name || me.email}`} className="mb-6">
          <p>Signing in again switches to another account.</p>
          <ButtonLink to={next} variant="secondary" className="mt-3">
            Continue
          </ButtonLink>
        </Notice>
      )}
      {errorText && (
        <Notice tone="error" title={errorText.title} className="mb-6" live>
          <p>{errorText.body}</p>
        </Notice>
      )}
      <div className="grid gap-6 md:grid-cols-2">
        <Card>
          <PasswordSignInForm callbackUrl={next} onSignedIn={() => void navigate(next, { replace: true })} />
        </Card>
        <Card>
          <SignInLinkForm
            callbackUrl={next}
            onSent={(email) => void navigate("/sign-in/check-email", { state: { email } })}
          />
        </Card>
      </div>
    </>
  );
}
