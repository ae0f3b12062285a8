import { Link } from "react-router";

export function SiteFooter() {
  return (
    <footer className="mt-16 border-t border-rule bg-paper-shade">
      <div aria-hidden="true" className="blend-ornament h-1 opacity-70" />
      <div className="mx-auto flex max-w-5xl flex-col gap-4 px-4 py-8 text-ink-soft sm:flex-row sm:items-start sm:justify-between">
        <div className="max-w-md space-y-1">
          <p className="font-bold text-ink">Blendwell</p>
          <p>
            A community gallery of blended ink strips: dried, photographed, and named ink by ink. Colours on screen are
            a guide; the dried strip on paper is the reference.
          </p>
        </div>
        <nav aria-label="Footer">
          <ul className="flex flex-wrap gap-x-1 gap-y-1 sm:flex-col sm:items-end">
            <li>
              <Link to="/gallery" className="inline-flex min-h-11 items-center px-2 hover:text-ink hover:underline">
                Gallery
              </Link>
            </li>
            <li>
              <Link to="/inks" className="inline-flex min-h-11 items-center px-2 hover:text-ink hover:underline">
                Ink catalogue
              </Link>
            </li>
            <li>
              <Link to="/help" className="inline-flex min-h-11 items-center px-2 hover:text-ink hover:underline">
                Help: photographing strips, safety
              </Link>
            </li>
            <li>
              <Link to="/account" className="inline-flex min-h-11 items-center px-2 hover:text-ink hover:underline">
                Your account
              </Link>
            </li>
            {import.meta.env.DEV && (
              <li>
                <Link to="/dev/mail" className="inline-flex min-h-11 items-center px-2 hover:text-ink hover:underline">
                  Mail viewer (development)
                </Link>
              </li>
            )}
          </ul>
        </nav>
      </div>
    </footer>
  );
}
