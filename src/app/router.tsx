import type { ComponentType } from "react";
import { createBrowserRouter } from "react-router";
import { Loading } from "../components/ui/loading";
import { AppLayout } from "./layout/app-layout";
import { RouteError } from "./layout/route-error";

/** Each page is its own chunk, loaded when first visited. */
const page = (load: () => Promise<{ default: ComponentType }>) => async () => ({ Component: (await load()).default });

export const router = createBrowserRouter([
  {
    path: "/",
    Component: AppLayout,
    ErrorBoundary: RouteError,
    HydrateFallback: () => <Loading className="mx-auto max-w-5xl px-4" label="Opening Blendwell…" />,
    children: [
      { index: true, lazy: page(() => import("./routes/home")) },
      { path: "gallery", lazy: page(() => import("./routes/gallery")) },
      { path: "search", lazy: page(() => import("./routes/search")) },
      { path: "plan", lazy: page(() => import("./routes/plan")) },
      { path: "post", lazy: page(() => import("./routes/post")) },
      { path: "strips/:id", lazy: page(() => import("./routes/strip")) },
      { path: "members/:id", lazy: page(() => import("./routes/member")) },
      { path: "help", lazy: page(() => import("./routes/help")) },
      { path: "inks", lazy: page(() => import("./routes/inks")) },
      { path: "inks/new", lazy: page(() => import("./routes/ink-new")) },
      { path: "inks/import", lazy: page(() => import("./routes/ink-import")) },
      { path: "inks/:id", lazy: page(() => import("./routes/ink")) },
      { path: "sign-in", lazy: page(() => import("./routes/sign-in")) },
      { path: "sign-in/check-email", lazy: page(() => import("./routes/sign-in-check-email")) },
      { path: "sign-in/confirm", lazy: page(() => import("./routes/sign-in-confirm")) },
      { path: "sign-in/error", lazy: page(() => import("./routes/sign-in-error")) },
      { path: "account", lazy: page(() => import("./routes/account")) },
      { path: "dev/mail", lazy: page(() => import("./routes/dev-mail")) },
      { path: "binders", lazy: page(() => import("./routes/binders")) },
      { path: "binders/:id", lazy: page(() => import("./routes/binder")) },
      { path: "stash", lazy: page(() => import("./routes/stash")) },
      { path: "review", lazy: page(() => import("./routes/review")) },
      { path: "moderation/log", lazy: page(() => import("./routes/moderation-log")) },
      { path: "notices", lazy: page(() => import("./routes/notices")) },
      { path: "*", lazy: page(() => import("./routes/not-found")) },
    ],
  },
]);
