import { Link } from "react-router";
import { Card } from "../../components/ui/card";
import { PageHeader } from "../../components/ui/page-header";

const photoSteps: { title: string; body: string }[] = [
  {
    title: "Let the ink dry first",
    body: "Ink looks different wet and dry. Wait until the strip is completely dry (heat-set pigment inks where the maker says to) before you photograph it.",
  },
  {
    title: "Daylight, or a daylight lamp",
    body: "Shoot by a window in daylight, out of direct sun, or under a daylight (about 5000–6500 K) lamp. Warm room lights tint everything yellow; we correct some of that against the paper, not all.",
  },
  {
    title: "No flash, no glare",
    body: "Turn the flash off. Tilt the card a little if a shiny patch of light sits on the ink: glare reads as a pale band.",
  },
  {
    title: "The whole white card in the frame",
    body: "Leave white paper showing all round the strip. We use it to find the paper white and correct the colour cast, so a strip cropped to its edges cannot be corrected.",
  },
  {
    title: "Hold the phone parallel to the card",
    body: "Hold the phone flat above the card, not at an angle, so the strip is not stretched at one end. A plain, dark surface under the card helps us find it.",
  },
  {
    title: "Colours still look off?",
    body: "After the analysis, tap a clean patch of white paper beside the strip on your photo. We correct the colours against that spot and find the bands again.",
  },
];

const safety: string[] = [
  "Heat tools get hot enough to burn skin and scorch surfaces. Rest them on a heat-proof mat, keep them away from children, and unplug them when you stop.",
  "Solvent-based and spray inks give off fumes: work with a window open or with other good ventilation, and keep them away from flames and heat tools.",
  "Follow the safety sheet and instructions that come with each product, and your local rules for using and throwing away inks, sprays and solvents.",
  "Keep inks, refills, sprays, blades and small parts out of reach of small children and pets.",
  "Wash your hands after blending, and before eating or touching your face.",
];

export default function HelpPage() {
  return (
    <>
      <PageHeader
        documentTitle="Help"
        title="Help"
        intro="How to photograph a strip so its colours can be read, and how to work with inks and tools safely."
      />
      <div className="flex flex-col gap-12">
        <section aria-labelledby="photo-help" className="flex flex-col gap-5">
          <h2 id="photo-help" className="text-2xl font-bold">
            Photographing a strip
          </h2>
          <ol className="grid gap-4 md:grid-cols-2">
            {photoSteps.map((step, i) => (
              <li key={step.title} className="flex gap-4 rounded-xl border border-rule bg-card p-4 shadow-card">
                <span className="grid h-9 w-9 shrink-0 place-items-center rounded-full bg-ink font-bold text-card tabular-nums">
                  {i + 1}
                </span>
                <div className="space-y-1">
                  <h3 className="font-bold">{step.title}</h3>
                  <p className="text-ink-soft">{step.body}</p>
                </div>
              </li>
            ))}
          </ol>
          <p className="text-ink-soft">
            Photos can be JPEG, PNG, WebP or HEIC, up to 20 MB. Location data (GPS) and all other hidden details are
            removed from every photo; only the picture is kept.{" "}
            <Link to="/post" className="font-bold text-accent underline">
              Post a strip
            </Link>
          </p>
        </section>

        <section aria-labelledby="safety-help" className="flex flex-col gap-5">
          <h2 id="safety-help" className="text-2xl font-bold">
            Care and safety
          </h2>
          <Card>
            <ul className="flex flex-col gap-3">
              {safety.map((line) => (
                <li key={line} className="flex gap-3">
                  <span aria-hidden="true" className="mt-2 h-2.5 w-2.5 shrink-0 rounded-full bg-warn" />
                  <span className="text-ink-soft">{line}</span>
                </li>
              ))}
            </ul>
          </Card>
        </section>

        <section aria-labelledby="words-help" className="flex flex-col gap-4">
          <h2 id="words-help" className="text-2xl font-bold">
            Words you will see
          </h2>
          <dl className="grid gap-x-8 gap-y-3 sm:grid-cols-2">
            {[
              ["Band", "A region of one colour found along the strip."],
              ["Ink order", "The strip's inks, in order from one end to the other."],
              ["ΔE2000", "How far apart two colours look, as a number: up to 1 indistinguishable, up to 2 barely different, up to 5 similar, up to 10 noticeably different, above that very different."],
              ["Hex", "The colour as screens show it, e.g. #3A6F8C. Your screen and the ink on paper will differ a little."],
              ["Review queue", "New members' strips wait here until a moderator approves them."],
              ["Trusted member", "A member whose strips are published without waiting for review."],
            ].map(([term, text]) => (
              <div key={term}>
                <dt className="font-bold">{term}</dt>
                <dd className="text-ink-soft">{text}</dd>
              </div>
            ))}
          </dl>
        </section>
      </div>
    </>
  );
}
