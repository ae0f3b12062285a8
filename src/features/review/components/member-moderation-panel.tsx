import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState, type ReactNode } from "react";
import { useForm, useWatch } from "react-hook-form";
import { Link } from "react-router";
import type { z } from "zod";
import type { Role } from "../../../../shared/schemas/accounts";
import { roleInput, standingInput, suspensionInput } from "../../../../shared/schemas/moderation";
import { Button } from "../../../components/ui/button";
import { Field, SelectInput, TextField } from "../../../components/ui/field";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { toast } from "../../../components/ui/toast";
import { errorMessage } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { formatDateTime } from "../../../lib/format";
import { useLatestModeration } from "../api/get-moderation-log";
import { useSetRole } from "../api/set-role";
import { useSetStanding } from "../api/set-standing";
import { useSetSuspension } from "../api/set-suspension";
import { logActionLabel, stateWords } from "../review-words";

export type MemberModerationPanelProps = {
  memberId: string;
  memberName: string;
  /**
   * The signed-in person's role. Role changes are offered to admins only; for members (or when
   * unknown) the panel shows nothing but what the server would allow anyway.
   */
  viewerRole?: Role;
  /** After a change, so the page can refresh what it shows about the member. */
  onChanged?: () => void;
};

type Failure = { message: string; details: string[] } | null;

function Section({ title, children }: { title: string; children: ReactNode }) {
  const id = useId();
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3 border-t border-rule pt-4 first:border-t-0 first:pt-0">
      <h3 id={id} className="text-lg font-bold">
        {title}
      </h3>
      {children}
    </section>
  );
}

function StandingForm({ memberId, memberName, onChanged }: Omit<MemberModerationPanelProps, "viewerRole">) {
  const setStanding = useSetStanding(memberId);
  const [failure, setFailure] = useState<Failure>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<z.input<typeof standingInput>, unknown, z.output<typeof standingInput>>({
    resolver: zodResolver(standingInput),
    defaultValues: { standing: "trusted", reason: "" },
  });
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await setStanding.mutateAsync(values);
      toast.success(values.standing === "trusted" ? `${memberName} is now a trusted member.` : `${memberName}'s strips go through the review queue again.`);
      reset({ standing: values.standing, reason: "" });
      onChanged?.();
    } catch (error) {
      setFailure({ message: errorMessage(error), details: applyApiFieldErrors(error, setError, ["standing", "reason"]) });
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-3">
      <FormAlert message={failure?.message} details={failure?.details} />
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,2fr)]">
        <Field label="New standing" error={formState.errors.standing?.message}>
          {(f) => (
            <SelectInput id={f.id} aria-describedby={f.describedBy} {...register("standing")}>
              <option value="trusted">Trusted member (skips review)</option>
              <option value="new">New member (posts wait for review)</option>
            </SelectInput>
          )}
        </Field>
        <TextField label="Reason" error={formState.errors.reason?.message} maxLength={300} {...register("reason")} />
      </div>
      <div>
        <Button type="submit" variant="secondary" busy={formState.isSubmitting} busyLabel="Saving…">
          Set standing
        </Button>
      </div>
    </form>
  );
}

function SuspensionForm({ memberId, memberName, onChanged }: Omit<MemberModerationPanelProps, "viewerRole">) {
  const setSuspension = useSetSuspension(memberId);
  const [failure, setFailure] = useState<Failure>(null);
  const { register, handleSubmit, setError, reset, control, formState } = useForm<z.input<typeof suspensionInput>, unknown, z.output<typeof suspensionInput>>({
    resolver: zodResolver(suspensionInput),
    defaultValues: { days: 7, reason: "" },
  });
  const days = useWatch({ control, name: "days" });
  const lifting = days === 0;
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      const result = await setSuspension.mutateAsync(values);
      toast.success(result.suspendedUntil ? `${memberName} is suspended until ${formatDateTime(result.suspendedUntil)}.` : `${memberName}'s suspension is lifted.`);
      reset({ days: values.days, reason: "" });
      onChanged?.();
    } catch (error) {
      setFailure({ message: errorMessage(error), details: applyApiFieldErrors(error, setError, ["days", "reason"]) });
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-3">
      <p className="text-sm text-ink-muted">A suspended member cannot post, report or save strips; their strips stay as they are. They are told why.</p>
      <FormAlert message={failure?.message} details={failure?.details} />
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,2fr)]">
        <TextField
          label="Days"
          hint="0 lifts a suspension."
          error={formState.errors.days?.message}
          type="number"
          inputMode="numeric"
          min={0}
          max={3650}
          step={1}
          {...register("days", { valueAsNumber: true })}
        />
        <TextField label="Reason" hint="The member is told this." error={formState.errors.reason?.message} maxLength={300} {...register("reason")} />
      </div>
      <div>
        <Button type="submit" variant={lifting ? "secondary" : "danger"} busy={formState.isSubmitting} busyLabel="Saving…">
          {lifting ? "Lift suspension" : Number.isInteger(days) && days > 0 ? `Suspend for ${days} ${days === 1 ? "day" : "days"}` : "Suspend"}
        </Button>
      </div>
    </form>
  );
}

function RoleForm({ memberId, memberName, onChanged }: Omit<MemberModerationPanelProps, "viewerRole">) {
  const setRole = useSetRole(memberId);
  const [failure, setFailure] = useState<Failure>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<z.input<typeof roleInput>, unknown, z.output<typeof roleInput>>({
    resolver: zodResolver(roleInput),
    defaultValues: { role: "member", reason: "" },
  });
  const submit = handleSubmit(async (values) => {
    setFailure(null);
    try {
      await setRole.mutateAsync(values);
      toast.success(`${memberName} is now ${values.role === "admin" ? "an admin" : `a ${values.role}`}.`);
      reset({ role: values.role, reason: "" });
      onChanged?.();
    } catch (error) {
      setFailure({ message: errorMessage(error), details: applyApiFieldErrors(error, setError, ["role", "reason"]) });
    }
  });
  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-3">
      <FormAlert message={failure?.message} details={failure?.details} />
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,2fr)]">
        <Field label="New role" error={formState.errors.role?.message}>
          {(f) => (
            <SelectInput id={f.id} aria-describedby={f.describedBy} {...register("role")}>
              <option value="member">Member</option>
              <option value="moderator">Moderator</option>
              <option value="admin">Admin</option>
            </SelectInput>
          )}
        </Field>
        <TextField label="Reason" error={formState.errors.reason?.message} maxLength={300} {...register("reason")} />
      </div>
      <div>
        <Button type="submit" variant="secondary" busy={formState.isSubmitting} busyLabel="Saving…">
          Change role
        </Button>
      </div>
    </form>
  );
}

function RecentModeration({ memberId }: { memberId: string }) {
  const latest = useLatestModeration({ member: memberId }, 5);
  if (latest.isPending) return <p className="text-ink-muted">Loading…</p>;
  if (latest.isError) return <Notice tone="error">{errorMessage(latest.error)}</Notice>;
  if (latest.data.items.length === 0) return <p className="text-ink-muted">Nothing recorded yet.</p>;
  return (
    <ul className="flex flex-col gap-1.5 text-sm">
      {latest.data.items.map((e) => (
        <li key={e.id}>
          <time dateTime={e.createdAt} className="text-ink-muted tabular-nums">
            {formatDateTime(e.createdAt)}
          </time>{" "}
          · <span className="font-bold">{logActionLabel(e.action)}</span>
          {e.strip && <> “{e.strip.title}”</>}
          {(e.before !== null || e.after !== null) && (
            <>
              {" "}
              ({stateWords(e.action, e.before)} → {stateWords(e.action, e.after)})
            </>
          )}{" "}
          by {e.moderator.name}: {e.reason}
        </li>
      ))}
    </ul>
  );
}

/**
 * A moderator's tools for one member, for their profile page: standing, suspension, role
 * (admins), and what was last decided about them. Every change needs a reason and is recorded.
 */
export function MemberModerationPanel({ memberId, memberName, viewerRole, onChanged }: MemberModerationPanelProps) {
  const id = useId();
  if (viewerRole === "member") return null;
  return (
    <section aria-labelledby={id} className="flex flex-col gap-5 rounded-xl border border-rule-strong bg-card p-4 shadow-card sm:p-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id={id} className="text-xl font-bold">
          Moderation: {memberName}
        </h2>
        <Link to={`/moderation/log?member=${memberId}`} className="font-bold text-accent underline">
          Full moderation history
        </Link>
      </div>
      <Section title="Recently">
        <RecentModeration memberId={memberId} />
      </Section>
      <Section title="Standing">
        <StandingForm memberId={memberId} memberName={memberName} onChanged={onChanged} />
      </Section>
      <Section title="Suspension">
        <SuspensionForm memberId={memberId} memberName={memberName} onChanged={onChanged} />
      </Section>
      {viewerRole === "admin" && (
        <Section title="Role">
          <RoleForm memberId={memberId} memberName={memberName} onChanged={onChanged} />
        </Section>
      )}
    </section>
  );
}
