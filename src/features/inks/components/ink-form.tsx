import { zodResolver } from "@hookform/resolvers/zod";
import { useId, useState } from "react";
import { Controller, useForm, useWatch, type FieldErrors, type Path, type Resolver } from "react-hook-form";
import type { z } from "zod";
import { deltaE2000, describeDeltaE, hexToLab, isHex, labToHex, normalizeHex, type Lab } from "../../../../shared/colour";
import { inkInput, inkTypes, type Brand, type Ink, type InkType } from "../../../../shared/schemas/inks";
import { Button } from "../../../components/ui/button";
import { Checkbox, Field, fieldErrorText, SelectInput, TextInput, TextField } from "../../../components/ui/field";
import { FormAlert, Notice } from "../../../components/ui/notice";
import { errorMessage } from "../../../lib/api-client";
import { applyApiFieldErrors } from "../../../lib/form-errors";
import { formatHex, formatLab, formatNumber } from "../../../lib/format";
import type { InkChanges } from "../api/update-ink";
import { colourWords } from "../colour-words";
import { BrandQuickAdd } from "./brand-quick-add";
import { InkSwatch } from "./ink-swatch";

type InkFormValues = z.input<typeof inkInput>;
export type InkFormOutput = z.output<typeof inkInput>;

const inkFieldNames: Path<InkFormValues>[] = ["name", "brandId", "type", "hex", "lab", "lab.l", "lab.a", "lab.b", "discontinued"];

const typeNotes: Record<InkType, string> = {
  dye: "thin, water-reactive, blends softly",
  pigment: "thicker and more opaque, dries slower",
  hybrid: "a mix of dye and pigment",
};

const schemaResolver = zodResolver(inkInput);

/** inkInput's own check, with plainer words for a brand that was never chosen. */
const inkResolver: Resolver<InkFormValues, unknown, InkFormOutput> = async (values, context, options) => {
  const result = await schemaResolver(values, context, options);
  const errors = result.errors as FieldErrors<InkFormValues>;
  if (errors.brandId && (values.brandId === undefined || values.brandId === "")) {
    errors.brandId = { ...errors.brandId, message: "must be chosen from the list" };
  }
  return result;
};

const emptyToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);
const toNumberOrUndefined = (v: unknown) => (v === "" || v === null || v === undefined ? undefined : Number(v));

function readHex(value: unknown): string | null {
  if (typeof value !== "string") return null;
  const candidate = value.trim().replace(/^#?/, "#");
  return isHex(candidate) ? normalizeHex(candidate) : null;
}

function readLab(value: unknown): Lab | null {
  if (typeof value !== "object" || value === null) return null;
  const { l, a, b } = value as Partial<Lab>;
  const ok = (n: unknown, min: number, max: number) => typeof n === "number" && Number.isFinite(n) && n >= min && n <= max;
  return ok(l, 0, 100) && ok(a, -128, 128) && ok(b, -128, 128) ? { l: l!, a: a!, b: b! } : null;
}

function pickChanged(values: InkFormOutput, dirty: Partial<Record<keyof InkFormValues, unknown>>): InkChanges {
  const changes: InkChanges = {};
  if (dirty.name) changes.name = values.name;
  if (dirty.brandId) changes.brandId = values.brandId;
  if (dirty.type) changes.type = values.type;
  if (dirty.hex && values.hex !== undefined) changes.hex = values.hex;
  if (dirty.lab && values.lab) changes.lab = values.lab;
  if (dirty.discontinued) changes.discontinued = values.discontinued;
  return changes;
}

type InkFormProps = {
  brands: Brand[];
  /** The ink being edited; without it the form adds a new ink. */
  ink?: Ink;
  submitLabel: string;
  busyLabel: string;
  /** Throw (an ApiError) to have the form show the problem; `changes` holds only edited fields. */
  onSubmit: (values: InkFormOutput, changes: InkChanges) => Promise<void>;
  onCancel?: () => void;
};

export function InkForm({ brands, ink, submitLabel, busyLabel, onSubmit, onCancel }: InkFormProps) {
  const id = useId();
  const editing = ink !== undefined;
  const [showLab, setShowLab] = useState(false);
  const [failure, setFailure] = useState<{ message: string; details: string[] } | null>(null);
  const [note, setNote] = useState<string | null>(null);

  const {
    register,
    control,
    handleSubmit,
    setValue,
    setError,
    formState: { errors, isSubmitting, dirtyFields },
  } = useForm<InkFormValues, unknown, InkFormOutput>({
    resolver: inkResolver,
    // Hidden L*a*b* inputs drop out of the values, so "hex only" sends no L*a*b*.
    shouldUnregister: true,
    defaultValues: ink
      ? { name: ink.name, brandId: ink.brand.id, type: ink.type, hex: ink.hex, lab: ink.lab, discontinued: ink.discontinued }
      : { name: "", brandId: undefined, type: undefined, hex: undefined, discontinued: false },
  });

  const hex = readHex(useWatch({ control, name: "hex" }));
  const labInput = useWatch({ control, name: "lab" });
  const lab = showLab ? readLab(labInput) : null;
  // One preview per way the colour was given, so a disagreement between them is visible.
  const previews = [
    ...(hex ? [{ source: "From hex", hex, lab: hexToLab(hex) }] : []),
    ...(lab ? [{ source: "From L*a*b*", hex: labToHex(lab), lab }] : []),
  ];
  const mismatch = hex && lab ? deltaE2000(hexToLab(hex), lab) : null;

  const submit = handleSubmit(async (values) => {
    setFailure(null);
    setNote(null);
    const changes = editing ? pickChanged(values, dirtyFields) : values;
    if (editing && Object.keys(changes).length === 0) {
      setNote("Nothing has changed yet.");
      return;
    }
    try {
      await onSubmit(values, changes);
    } catch (error) {
      const details = applyApiFieldErrors(error, setError, inkFieldNames);
      setFailure({ message: errorMessage(error), details });
    }
  });

  return (
    <form noValidate onSubmit={submit} className="flex flex-col gap-6" aria-describedby={`${id}-required`}>
      <p id={`${id}-required`} className="text-sm text-ink-muted">
        All fields are needed unless marked optional. The colour can be given as hex, as L*a*b*, or both.
      </p>
      <FormAlert message={failure?.message} details={failure?.details} />
      {note && (
        <Notice tone="info" live>
          {note}
        </Notice>
      )}

      <TextField label="Name" error={errors.name?.message} autoComplete="off" maxLength={80} {...register("name")} />

      <div className="flex flex-col gap-2">
        <Field label="Brand" error={errors.brandId?.message}>
          {(f) => (
            <Controller
              control={control}
              name="brandId"
              render={({ field }) => (
                <SelectInput
                  id={f.id}
                  ref={field.ref}
                  name={field.name}
                  onBlur={field.onBlur}
                  aria-describedby={f.describedBy}
                  aria-invalid={f.invalid || undefined}
                  value={field.value === undefined || field.value === null ? "" : String(field.value)}
                  onChange={(e) => field.onChange(e.target.value === "" ? undefined : Number(e.target.value))}
                >
                  <option value="">Choose a brand…</option>
                  {brands.map((b) => (
                    <option key={b.id} value={b.id}>
                      {b.name}
                    </option>
                  ))}
                </SelectInput>
              )}
            />
          )}
        </Field>
        <BrandQuickAdd onAdded={(brand) => setValue("brandId", brand.id, { shouldDirty: true, shouldValidate: true })} />
      </div>

      <fieldset aria-describedby={errors.type ? `${id}-type-error` : undefined}>
        <legend className="mb-1.5 font-bold">Ink type</legend>
        <div className="grid gap-2 sm:grid-cols-3">
          {inkTypes.map((t) => (
            <label
              key={t}
              className="flex min-h-11 cursor-pointer items-start gap-3 rounded-md border border-rule-strong bg-card px-3 py-2.5 has-checked:border-accent has-checked:bg-accent-soft has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-accent"
            >
              <input type="radio" value={t} className="mt-1 h-4 w-4 accent-accent focus-visible:outline-none" {...register("type")} />
              <span>
                <span className="block font-bold capitalize">{t}</span>
                <span className="block text-sm text-ink-muted">{typeNotes[t]}</span>
              </span>
            </label>
          ))}
        </div>
        {errors.type?.message && (
          <p id={`${id}-type-error`} className="mt-1.5 text-sm font-bold text-danger">
            ! {fieldErrorText("Ink type", errors.type.message)}
          </p>
        )}
      </fieldset>

      <fieldset className="flex flex-col gap-4 rounded-xl border border-rule bg-paper p-4">
        <legend className="px-1 font-bold">Reference colour</legend>
        <div className="flex flex-col gap-4 sm:flex-row sm:items-start">
          <Field
            label="Hex"
            optional={showLab}
            className="flex-1"
            hint="The colour on screen, e.g. #3a6f8c. Type it or pick it."
            error={errors.hex?.message}
          >
            {(f) => (
              <div className="flex gap-2">
                <TextInput
                  id={f.id}
                  aria-describedby={f.describedBy}
                  aria-invalid={f.invalid || undefined}
                  autoComplete="off"
                  spellCheck={false}
                  placeholder="#3a6f8c"
                  className="font-bold tabular-nums"
                  {...register("hex", { setValueAs: emptyToUndefined })}
                />
                <input
                  type="color"
                  aria-label="Pick the hex colour on screen"
                  value={hex ?? "#ffffff"}
                  onChange={(e) => setValue("hex", e.target.value, { shouldDirty: true, shouldValidate: true })}
                  className="h-11 w-14 shrink-0 cursor-pointer rounded-md border border-rule-strong bg-card p-1"
                />
              </div>
            )}
          </Field>
        </div>

        <Checkbox
          label={editing ? "Change the measured L*a*b* values" : "I have measured L*a*b* values"}
          hint="CIELAB under D65 light, read from a dried swatch on white cardstock."
          checked={showLab}
          onChange={(e) => setShowLab(e.target.checked)}
        />
        {showLab && (
          <div className="grid grid-cols-3 gap-3">
            {(
              [
                ["l", "L*", "0 to 100"],
                ["a", "a*", "−128 to 128"],
                ["b", "b*", "−128 to 128"],
              ] as const
            ).map(([key, label, range]) => (
              <TextField
                key={key}
                label={label}
                hint={range}
                error={errors.lab?.[key]?.message}
                type="number"
                step="any"
                inputMode="decimal"
                inputClassName="tabular-nums"
                {...register(`lab.${key}`, { setValueAs: toNumberOrUndefined })}
              />
            ))}
            {errors.lab?.message && <p className="col-span-3 text-sm font-bold text-danger">! {errors.lab.message}</p>}
          </div>
        )}

        <div aria-live="polite" className="flex flex-col gap-3 rounded-lg border border-rule bg-card p-3">
          {previews.length > 0 ? (
            previews.map((p) => (
              <div key={p.source} className="flex items-center gap-4">
                <InkSwatch hex={p.hex} className="h-16 w-24" />
                <p className="text-ink-soft">
                  <span className="block text-sm">{previews.length > 1 ? p.source : "Preview"}</span>
                  <span className="block font-bold text-ink">{colourWords(p.lab)}</span>
                  <span className="block tabular-nums">
                    {formatHex(p.hex)} · {formatLab(p.lab)}
                  </span>
                </p>
              </div>
            ))
          ) : (
            <div className="flex items-center gap-4">
              <div aria-hidden="true" className="h-16 w-24 shrink-0 rounded-md border border-dashed border-rule-strong" />
              <p className="text-ink-muted">The preview appears once the colour is complete.</p>
            </div>
          )}
        </div>
        {mismatch !== null && mismatch > 2 && (
          <Notice tone="warning" title="Hex and L*a*b* disagree">
            They are ΔE2000 {formatNumber(mismatch)} apart ({describeDeltaE(mismatch)}). Check that both describe the
            same ink; a measured L*a*b* is usually the better reference.
          </Notice>
        )}
      </fieldset>

      <Checkbox
        label="Discontinued"
        hint="The maker no longer sells this ink. It stays in the catalogue for older strips."
        {...register("discontinued")}
      />

      <div className="flex flex-wrap gap-3 border-t border-rule pt-5">
        <Button type="submit" busy={isSubmitting} busyLabel={busyLabel}>
          {submitLabel}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}

