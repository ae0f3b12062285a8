import { useSearchParams } from "react-router";
import { ButtonLink } from "../../components/ui/button";
import { Card } from "../../components/ui/card";
import { Notice } from "../../components/ui/notice";
import { DocumentTitle } from "../../components/ui/page-header";
import { signInErrorText } from "../../features/accounts/sign-in-errors";

export default function SignInErrorPage() {
  const [params] = useSearchParams();
  const text = signInErrorText(params.get("error"));
  return (
    <Card className="mx-auto max-w-xl space-y-5">
      <DocumentTitle title="Sign-in problem" />
      <h1 className="text-3xl font-bold">Sign-in did not work</h1>
      <Notice tone="error" title={text.title}>
        <p>{text.body}</p>
      </Notice>
      <div className="flex flex-wrap gap-3">
        <ButtonLink to="/sign-in">Try signing in again</ButtonLink>
        <ButtonLink to="/" variant="secondary">
          Go to the gallery
        </ButtonLink>
      </div>
    </Card>
  );
}
