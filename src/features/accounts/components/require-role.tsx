import type { ReactNode } from "react";
import { Navigate, useLocation } from "react-router";
import type { Me, Role } from "../../../../shared/schemas/accounts";
import { Button } from "../../../components/ui/button";
import { Loading } from "../../../components/ui/loading";
import { Notice } from "../../../components/ui/notice";
import { DocumentTitle } from "../../../components/ui/page-header";
import { errorMessage } from "../../../lib/api-client";
import { hasRole, roleLabels } from "../../../lib/roles";
import { useMe } from "../api/get-me";

type RequireRoleProps = {
  /** Lowest role allowed in; "member" means any signed-in person. */
  role?: Role;
  children: (me: Me) => ReactNode;
};

/**
 * Shows its children only to signed-in people with at least `role`. Visitors go to sign-in and
 * come back here afterwards. The server checks every request again; this only spares people a
 * page of controls that would be refused.
 */
export function RequireRole({ role = "member", children }: RequireRoleProps) {
  const location = useLocation();
  const me = useMe();

  if (me.isPending) return <Loading label="Checking who is signed in…" />;
  if (me.isError) {
    return (
      <Notice tone="error" title="We could not check who is signed in" live>
        <p>{errorMessage(me.error)}</p>
        <Button variant="secondary" className="mt-3" onClick={() => void me.refetch()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (!me.data) {
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  if (!hasRole(me.data.role, role)) {
    const who = role === "admin" ? "admins" : `${roleLabels[role].toLowerCase()}s and admins`;
    return (
      <>
        <DocumentTitle title="Not allowed" />
        <Notice tone="warning" title="This page is not open to your account">
          <p>Only {who} can use it. You are signed in as a {roleLabels[me.data.role].toLowerCase()}.</p>
        </Notice>
      </>
    );
  }
  return <>{children(me.data)}</>;
}
