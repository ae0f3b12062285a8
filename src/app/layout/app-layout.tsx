import { useEffect, useRef, type ReactNode } from "react";
import { Outlet, ScrollRestoration, useLocation, useNavigation } from "react-router";
import { SiteFooter } from "./site-footer";
import { SiteHeader } from "./site-header";

function NavigationProgress() {
  const navigation = useNavigation();
  const busy = navigation.state !== "idle";
  return (
    <div aria-hidden="true" className={`fixed inset-x-0 top-0 z-50 h-0.5 overflow-hidden ${busy ? "" : "invisible"}`}>
      <div className="blend-ornament progress-slide h-full w-2/5" />
    </div>
  );
}

export function AppLayout({ children }: { children?: ReactNode }) {
  const location = useLocation();
  const main = useRef<HTMLElement>(null);
  const shownPath = useRef(location.pathname);

  // After an in-app navigation, start screen readers and keyboards at the new page's content.
  // (Not on first load, where the skip link must stay the first stop.)
  useEffect(() => {
    if (shownPath.current === location.pathname) return;
    shownPath.current = location.pathname;
    main.current?.focus({ preventScroll: true });
  }, [location.pathname]);

  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only z-[60] rounded-md bg-ink px-4 py-3 font-bold text-card focus:not-sr-only focus:fixed focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      <NavigationProgress />
      <SiteHeader />
      <main ref={main} id="main" tabIndex={-1} className="mx-auto w-full max-w-5xl flex-1 px-4 pt-8 pb-4 sm:pt-12">
        {children ?? <Outlet />}
      </main>
      <SiteFooter />
      <ScrollRestoration />
    </div>
  );
}
