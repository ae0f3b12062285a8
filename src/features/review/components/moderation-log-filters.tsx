import { useState, type FormEvent } from "react";
import { Button } from "../../../components/ui/button";
import { Field, SelectInput, TextField } from "../../../components/ui/field";
import { logFilterProblems, logFiltersFromSearchParams, type LogFilters } from "../log-filters";
import { logActions } from "../review-words";

type ModerationLogFiltersProps = {
  filters: LogFilters;
  onChange: (filters: LogFilters) => void;
};

/** Filter the audit trail by action, strip and member; the page keeps them in the address. */
export function ModerationLogFilters({ filters, onChange }: ModerationLogFiltersProps) {
  const [action, setAction] = useState(filters.action ?? "");
  const [strip, setStrip] = useState(filters.strip ? String(filters.strip) : "");
  const [member, setMember] = useState(filters.member ?? "");
  const [problems, setProblems] = useState<{ strip?: string; member?: string }>({});

  // When the address changes (a link, the back button), show what it says.
  const [shown, setShown] = useState(filters);
  if (shown !== filters && JSON.stringify(shown) !== JSON.stringify(filters)) {
    setShown(filters);
    setAction(filters.action ?? "");
    setStrip(filters.strip ? String(filters.strip) : "");
    setMember(filters.member ?? "");
    setProblems({});
  }

  function submit(e: FormEvent) {
    e.preventDefault();
    const found = logFilterProblems({ strip, member });
    setProblems(found);
    if (found.strip || found.member) return;
    const parsed = logFiltersFromSearchParams(new URLSearchParams({ strip, member }));
    onChange({ ...filters, action: action || undefined, strip: parsed.strip, member: parsed.member });
  }

  return (
    <form noValidate onSubmit={submit} aria-label="Filter the moderation log" className="grid items-end gap-3 sm:grid-cols-[minmax(0,1.2fr)_minmax(0,0.8fr)_minmax(0,1.6fr)_auto]">
      <Field label="Action">
        {(f) => (
          <SelectInput id={f.id} value={action} onChange={(e) => setAction(e.target.value)}>
            <option value="">All actions</option>
            {logActions.map((a) => (
              <option key={a.value} value={a.value}>
                {a.label}
              </option>
            ))}
          </SelectInput>
        )}
      </Field>
      <TextField
        label="Strip number"
        error={problems.strip}
        inputMode="numeric"
        autoComplete="off"
        placeholder="e.g. 12"
        value={strip}
        onChange={(e) => setStrip(e.target.value)}
      />
      <TextField
        label="Member id"
        error={problems.member}
        autoComplete="off"
        spellCheck={false}
        placeholder="from a member's page"
        value={member}
        onChange={(e) => setMember(e.target.value)}
      />
      <Button type="submit" variant="secondary">
        Show
      </Button>
    </form>
  );
}
