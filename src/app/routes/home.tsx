import { ColourSwatch } from "../../components/ui/colour-swatch";
import { Link } from "react-router";
import { ButtonLink } from "../../components/ui/button";
import { DocumentTitle } from "../../components/ui/page-header";
import { useMe } from "../../features/accounts/api/get-me";
import { StripFeed } from "../../features/strips/components/strip-feed";

/** Starting points for a colour search: our own picks and names, not the colours of any ink. */
const startingColours = [
  ["#2f7f86", "Teal"],
  ["#b5532e", "Rust"],
  ["#d9b23a", "Mustard"],
  ["#6f4a83", "Plum"],
  ["#2e4f8f", "Deep blue"],
  ["#d97a93", "Rose"],
] as const;

export default function HomePage() {
  const { data: me, isPending } = useMe();
  return (
    <div className="flex flex-col gap-14">
      <DocumentTitle title="" />
      <section aria-labelledby="home-title" className="grid gap-8 md:grid-cols-[3fr_2fr] md:items-center">
        <div className="space-y-5">
          <p className="text-sm font-bold tracking-wide text-ink-muted uppercase">For card makers, scrapbookers and ink blenders</p>
          <h1 id="home-title" className="text-4xl leading-[1.1] font-bold text-balance sm:text-5xl">
            See how inks really blend, on paper, before you buy the next one.
          </h1>
          <p className="max-w-prose text-lg text-ink-soft">
            Welcome to Blendwell. Crafters photograph their dried blended strips, name the inks in order, and share
            them here, so everyone can find combinations that flow and inks they do not own yet.
          </p>
          <div className="flex flex-wrap gap-3">
            {me ? <ButtonLink to="/post">Post a strip</ButtonLink> : <ButtonLink to="/gallery">See the gallery</ButtonLink>}
            <ButtonLink to="/search" variant="secondary">
              Find combinations
            </ButtonLink>
            <ButtonLink to="/inks" variant="secondary">
              Browse the ink catalogue
            </ButtonLink>
            {!isPending && !me && (
              <ButtonLink to="/sign-in" variant="secondary">
                Join or sign in
              </ButtonLink>
            )}
          </div>
        </div>
        {/* An ornament in the shape of a strip; no real inks or post behind it. */}
        <figure aria-hidden="true" className="rotate-[-2deg] rounded-lg border border-rule bg-card p-3 shadow-lifted">
          <div className="blend-ornament h-20 rounded-sm sm:h-24" />
          <div className="mt-2 flex justify-between gap-2 px-0.5">
            {["#23506b", "#3f8593", "#e3c566", "#d9855b", "#8e4a6e"].map((c) => (
              <span key={c} className="h-3 flex-1 rounded-full opacity-80" style={{ backgroundColor: c }} />
            ))}
          </div>
        </figure>
      </section>

      <section aria-labelledby="find-title" className="space-y-3">
        <h2 id="find-title" className="text-2xl font-bold">
          Start from a colour
        </h2>
        <p className="text-ink-soft">Strips with a band close to one of these, or pick your own colour on the search page.</p>
        <ul className="flex flex-wrap gap-2">
          {startingColours.map(([hex, words]) => (
            <li key={hex}>
              <Link
                to={`/search?color=${encodeURIComponent(hex)}`}
                className="inline-flex min-h-11 items-center gap-2 rounded-full border border-rule-strong bg-card py-1 pr-4 pl-1 font-bold hover:border-ink-muted"
              >
                <ColourSwatch hex={hex} className="h-8 w-8 rounded-full" />
                {words}
              </Link>
            </li>
          ))}
          <li>
            <Link to={me ? "/search?stash=all" : "/search"} className="inline-flex min-h-11 items-center px-3 font-bold text-accent hover:underline">
              {me ? "Strips I can blend with my stash" : "More ways to search"} <span aria-hidden="true">&nbsp;→</span>
            </Link>
          </li>
        </ul>
      </section>

      <section aria-labelledby="newest-title" className="space-y-4">
        <div className="flex items-end justify-between gap-4 border-b border-rule pb-3">
          <h2 id="newest-title" className="text-2xl font-bold">
            Newest strips
          </h2>
          <Link to="/gallery" className="inline-flex min-h-11 items-center font-bold text-accent hover:underline">
            The whole gallery <span aria-hidden="true">&nbsp;→</span>
          </Link>
        </div>
        <StripFeed
          filters={{ sort: "newest", limit: 5 }}
          label="Newest strips"
          loadMore={false}
          empty={
            <div className="rounded-xl border-2 border-dashed border-rule-strong bg-card/60 px-5 py-10 text-center sm:px-10">
              <p className="text-xl font-bold">No strips yet</p>
              <p className="mx-auto mt-2 max-w-prose text-ink-soft">
                Each strip shows here as a wide band with its inks, in order, underneath. Until the first one arrives, the
                ink catalogue is open to browse.
              </p>
              <ButtonLink to={me ? "/post" : "/inks"} variant="quiet" className="mt-4">
                {me ? "Post the first strip" : "Look through the inks"} <span aria-hidden="true">→</span>
              </ButtonLink>
            </div>
          }
        />
      </section>
    </div>
  );
}
