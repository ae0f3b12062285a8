import { useState } from "react";
import { StashSwatches } from "../../features/stash/components/stash-swatches";
import type { Me } from "../../../shared/schemas/accounts";
import { Card } from "../../components/ui/card";
import { Notice } from "../../components/ui/notice";
import { PageHeader } from "../../components/ui/page-header";
import { PasswordForm } from "../../features/accounts/components/password-form";
import { ProfileForm } from "../../features/accounts/components/profile-form";
import { RequireRole } from "../../features/accounts/components/require-role";
import { RoleBadge } from "../../features/accounts/components/role-badge";
import { SignOutEverywhere } from "../../features/accounts/components/sign-out-everywhere";
import { formatDate, formatDateTime } from "../../lib/format";

const standingText: Record<Me["standing"], { label: string; note: string }> = {
  new: { label: "New member", note: "Your strips wait in the review queue until a moderator approves them." },
  trusted: { label: "Trusted member", note: "Your strips are published straight away." },
};

const roleNotes: Record<Me["role"], string> = {
  member: "Post strips, keep a stash and binders.",
  moderator: "You also look after the review queue and the ink catalogue.",
  admin: "You also manage roles and site settings.",
};

function AccountFacts({ me }: { me: Me }) {
  const [openedAt] = useState(() => Date.now());
  const suspended = me.suspendedUntil !== null && Date.parse(me.suspendedUntil) > openedAt;
  return (
    <div className="space-y-4">
      {suspended && (
        <Notice tone="warning" title={`Your account is suspended until ${formatDateTime(me.suspendedUntil!)}`}>
          <p>Until then you can browse, but not post or change anything.</p>
        </Notice>
      )}
      <dl className="divide-y divide-rule">
        <div className="py-3">
          <dt className="text-sm text-ink-muted">E-mail</dt>
          <dd className="font-bold break-all">{me.email}</dd>
        </div>
        <div className="py-3">
          <dt className="text-sm text-ink-muted">Role</dt>
          <dd className="flex flex-col gap-1">
            <span>
              <RoleBadge role={me.role} always />
            </span>
            <span className="text-ink-soft">{roleNotes[me.role]}</span>
          </dd>
        </div>
        <div className="py-3">
          <dt className="text-sm text-ink-muted">Standing</dt>
          <dd>
            <span className="font-bold">{standingText[me.standing].label}</span>
            <span className="block text-ink-soft">{standingText[me.standing].note}</span>
          </dd>
        </div>
        <div className="py-3">
          <dt className="text-sm text-ink-muted">Member since</dt>
          <dd className="font-bold">{formatDate(me.createdAt)}</dd>
        </div>
      </dl>
    </div>
  );
}

export default function AccountPage() {
  return (
    <RequireRole>
      {(me) => (
        <>
          <PageHeader documentTitle="Your account" eyebrow="Your account" title={me.name || me.email} />
          <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
            <div className="flex flex-col gap-6">
              <Card>
                <h2 className="mb-4 text-xl font-bold">Profile</h2>
                <ProfileForm me={me} />
              </Card>
              <Card>
                <h2 className="mb-1 text-xl font-bold">{me.hasPassword ? "Change password" : "Set a password"}</h2>
                <p className="mb-4 text-ink-soft">
                  {me.hasPassword
                    ? "You can also always sign in with a link by e-mail."
                    : "You sign in with links by e-mail. A password lets you sign in without waiting for mail."}
                </p>
                <PasswordForm email={me.email} hasPassword={me.hasPassword} />
              </Card>
            </div>
            <div className="flex flex-col gap-6 self-start">
              <Card>
                <h2 className="mb-2 text-xl font-bold">About your account</h2>
                <AccountFacts me={me} />
              </Card>
              <Card>
                <h2 className="mb-2 text-xl font-bold">Where you are signed in</h2>
                <SignOutEverywhere />
              </Card>
              <Card>
                <h2 className="mb-3 text-xl font-bold">Your stash</h2>
                <StashSwatches />
              </Card>
            </div>
          </div>
        </>
      )}
    </RequireRole>
  );
}
