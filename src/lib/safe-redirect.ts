/**
 * A path inside this app to go to after signing in, or null. Only "/…" paths on this origin are
 * allowed, so a crafted `next` cannot send anyone to another site.
 */
export function safeInternalPath(next: string | null | undefined): string | null {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return null;
  try {
    const url = new URL(next, window.location.origin);
    if (url.origin !== window.location.origin) return null;
    return `${url.pathname}${url.search}${url.hash}`;
  } catch {
    return null;
  }
}

/**
 * The magic-link target, if it is one of our own Auth.js callbacks; null for anything else.
 * Mail scanners open links, so the link lands on a page and only a button press uses the token.
 */
export function safeAuthCallbackUrl(next: string | null | undefined): string | null {
  if (!next) return null;
  try {
    const url = new URL(next, window.location.origin);
    if (url.origin !== window.location.origin) return null;
    if (!url.pathname.startsWith("/auth/callback/")) return null;
    return url.href;
  } catch {
    return null;
  }
}
