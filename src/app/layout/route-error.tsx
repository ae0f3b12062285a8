import { isRouteErrorResponse, useRouteError } from "react-router";
import { Button, ButtonLink } from "../../components/ui/button";
import { Notice } from "../../components/ui/notice";
import { DocumentTitle } from "../../components/ui/page-header";
import { errorMessage } from "../../lib/api-client";
import { AppLayout } from "./app-layout";

/** Shown when a page itself fails to load or render; the header stays usable. */
export function RouteError() {
  const error = useRouteError();
  const notFound = isRouteErrorResponse(error) && error.status === 404;
  // A new deployment replaces the page's code files; an old tab then cannot fetch them.
  const staleBundle = error instanceof TypeError && /dynamically imported module|Importing a module script/i.test(error.message);

  return (
    <AppLayout>
      <DocumentTitle title={notFound ? "Page not found" : "Something went wrong"} />
      <div className="mx-auto max-w-xl space-y-5 py-8">
        <h1 className="text-3xl font-bold">{notFound ? "Page not found" : "This page could not be shown"}</h1>
        <Notice tone="error" title={staleBundle ? "Blendwell has been updated" : "Something went wrong"}>
          <p>
            {staleBundle
              ? "Reload the page to get the newest version."
              : isRouteErrorResponse(error)
                ? `${error.status} ${error.statusText}`
                : errorMessage(error)}
          </p>
        </Notice>
        <div className="flex flex-wrap gap-3">
          <Button onClick={() => window.location.reload()}>Reload the page</Button>
          <ButtonLink to="/" variant="secondary">
            Go to the gallery
          </ButtonLink>
        </div>
      </div>
    </AppLayout>
  );
}
