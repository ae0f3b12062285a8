const MINUS = "\u2212";

/** A number with a fixed count of decimals and a real minus sign, e.g. −12.4. */
export function formatNumber(value: number, decimals = 1): string {
  const rounded = Number(value.toFixed(decimals));
  const text = Math.abs(rounded).toFixed(decimals);
  return rounded < 0 ? `${MINUS}${text}` : text;
}

export type LabLike = { l: number; a: number; b: number };

/** "L* 52.3 · a* −12.4 · b* 30.1" */
export function formatLab(lab: LabLike): string {
  return `L* ${formatNumber(lab.l)} · a* ${formatNumber(lab.a)} · b* ${formatNumber(lab.b)}`;
}

/** "#3a6f8c" → "#3A6F8C": upper case reads more easily beside other numbers. */
export function formatHex(hex: string): string {
  return hex.toUpperCase();
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric" });
const dateTimeFormat = new Intl.DateTimeFormat("en-GB", {
  day: "numeric",
  month: "short",
  year: "numeric",
  hour: "2-digit",
  minute: "2-digit",
});

function toDate(value: string | Date): Date | null {
  const date = value instanceof Date ? value : new Date(value);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "4 March 2025"; an unreadable date is shown as given. */
export function formatDate(value: string | Date): string {
  const date = toDate(value);
  return date ? dateFormat.format(date) : String(value);
}

/** "4 Mar 2025, 14:05" */
export function formatDateTime(value: string | Date): string {
  const date = toDate(value);
  return date ? dateTimeFormat.format(date) : String(value);
}

/** plural(1, "ink") → "1 ink"; plural(3, "ink") → "3 inks"; plural(2, "brand", "brands"). */
export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count.toLocaleString("en-GB")} ${count === 1 ? one : many}`;
}

/** "Dye", "Pigment": capitalise a single lower-case word for display. */
export function capitalise(word: string): string {
  return word.charAt(0).toUpperCase() + word.slice(1);
}
