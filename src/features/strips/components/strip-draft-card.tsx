import { Link } from "react-router";
import { statusLabels } from "../../../../shared/schemas/strips";
import type { StripReading } from "../../../../shared/schemas/uploads";
import { ColourSwatch } from "../../../components/ui/colour-swatch";
import { Checkbox, TextField } from "../../../components/ui/field";
import { Notice } from "../../../components/ui/notice";
import { colourWords } from "../../../lib/colour-words";
import { formatHex, plural } from "../../../lib/format";
import type { InkColourLookup, InkPickerSlot } from "../ink-choice";
import type { StripDraft } from "../strip-drafts";
import { InkOrderEditor } from "./ink-order-editor";

type StripDraftCardProps = {
  index: number;
  reading: Pick<StripReading, "bands" | "orientation">;
  draft: StripDraft;
  onChange: (draft: StripDraft) => void;
  inkColour: InkColourLookup;
  picker: InkPickerSlot;
  disabled: boolean;
  /** The problem shown under the title or ink order after a try to post. */
  error?: string;
};

/** One strip of a several-strip photo as a draft: tick it to post it, its bands, title and ink order. */
export function StripDraftCard({ index, reading, draft, onChange, inkColour, picker, disabled, error }: StripDraftCardProps) {
  const n = index + 1;
  const posted = draft.posted;
  return (
    <li
      className={`flex flex-col gap-5 rounded-xl border bg-card p-4 shadow-card sm:p-5 ${draft.ticked && !posted ? "border-accent" : "border-rule"}`}
      data-testid="strip-draft"
      aria-labelledby={`strip-draft-${n}`}
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <h3 id={`strip-draft-${n}`} className="text-xl font-bold">
          Strip {n} <span className="font-normal text-ink-soft">· {plural(reading.bands.length, "band")}</span>
        </h3>
        {posted ? (
          <p className="font-bold text-success">
            {posted.status === "published" ? "Posted and published." : posted.status === "pending" ? "Posted; waiting for review." : `Posted: ${statusLabels[posted.status].toLowerCase()}.`}{" "}
            <Link to={`/strips/${posted.id}`} className="text-accent underline">
              See strip {n}
            </Link>
          </p>
        ) : (
          <Checkbox
            label={`Post strip ${n}`}
            checked={draft.ticked}
            disabled={disabled}
            onChange={(e) => onChange({ ...draft, ticked: e.currentTarget.checked })}
            data-testid="post-this-strip"
          />
        )}
      </div>

      <ol className="flex flex-wrap gap-2" aria-label={`Bands of strip ${n}`}>
        {reading.bands.map((band) => (
          <li key={band.index} className="flex items-center gap-2 rounded-md border border-rule bg-paper px-2 py-1 text-sm">
            <ColourSwatch hex={band.hex} className="h-7 w-9" />
            <span>
              <span className="font-bold">Band {band.index + 1}</span> {colourWords(band.lab)}, {formatHex(band.hex)}
            </span>
          </li>
        ))}
      </ol>

      {!posted && draft.ticked && (
        <>
          {draft.remeasured && (
            <Notice tone="info" title={`Strip ${n} was measured again`}>
              <p>Its ink order is kept as you left it. Check it against the new bands.</p>
            </Notice>
          )}
          <TextField
            label={`Title of strip ${n}`}
            hint="We started one from its first and last ink; change it as you like."
            value={draft.title}
            maxLength={100}
            autoComplete="off"
            disabled={disabled}
            error={error?.includes("title") ? error : undefined}
            onChange={(e) => onChange({ ...draft, title: e.currentTarget.value, titleTouched: true })}
          />
          <InkOrderEditor
            inks={draft.inks}
            onChange={(inks) => onChange({ ...draft, inks, inksTouched: true })}
            inkColour={inkColour}
            picker={picker}
            orientation={reading.orientation}
            disabled={disabled}
            error={error && !error.includes("title") ? error : undefined}
            intro={`We filled in the best suggestion for each band of strip ${n}; change anything that is not right.`}
          />
        </>
      )}
    </li>
  );
}
