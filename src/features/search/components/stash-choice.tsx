import { Link } from "react-router";
import type { StashMode } from "../../../../shared/schemas/search";

const choices: { value: StashMode | undefined; label: string; hint: string }[] = [
  { value: undefined, label: "Any inks", hint: "Every strip, whatever its inks." },
  { value: "all", label: "Inks I own", hint: "Strips you can blend now with your stash." },
  { value: "missingOne", label: "One ink short", hint: "Strips missing one ink you do not own, and which one." },
];

type StashChoiceProps = {
  value: StashMode | undefined;
  onChange: (value: StashMode | undefined) => void;
  /** Visitors are asked to sign in instead. */
  signedIn: boolean;
  signInHref: string;
};

/** Narrow the search to what a member can blend with the inks in their stash. */
export function StashChoice({ value, onChange, signedIn, signInHref }: StashChoiceProps) {
  if (!signedIn) {
    return (
      <div className="flex flex-col gap-1">
        <p className="text-sm text-ink-soft">
          <Link to={signInHref} className="font-bold text-accent hover:underline">
            Sign in
          </Link>{" "}
          to find strips you can blend with the inks you own.
        </p>
      </div>
    );
  }
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="sr-only">By your stash</legend>
      {choices.map((c) => (
        <label key={c.label} className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md px-1 py-1.5 hover:bg-paper-shade">
          <input
            type="radio"
            name="stash"
            className="mt-1 h-5 w-5 shrink-0 accent-accent"
            checked={value === c.value}
            onChange={() => onChange(c.value)}
          />
          <span className="leading-tight">
            <span className="block font-bold">{c.label}</span>
            <span className="block text-sm text-ink-muted">{c.hint}</span>
          </span>
        </label>
      ))}
    </fieldset>
  );
}
