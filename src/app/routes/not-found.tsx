import { ButtonLink } from "../../components/ui/button";
import { DocumentTitle } from "../../components/ui/page-header";

export default function NotFoundPage({ what = "page" }: { what?: string }) {
  return (
    <div className="mx-auto max-w-xl space-y-5 py-8 text-center">
      <DocumentTitle title={`No such ${what}`} />
      <div aria-hidden="true" className="mx-auto h-3 w-40 rounded-full bg-rule" />
      <h1 className="text-3xl font-bold">We could not find that {what}</h1>
      <p className="text-lg text-ink-soft">
        The link may be mistyped, or the {what} was removed. The catalogue and the gallery are a good place to start
        again.
      </p>
      <div className="flex flex-wrap justify-center gap-3">
        <ButtonLink to="/">Go to the gallery</ButtonLink>
        <ButtonLink to="/inks" variant="secondary">
          Browse inks
        </ButtonLink>
      </div>
    </div>
  );
}
