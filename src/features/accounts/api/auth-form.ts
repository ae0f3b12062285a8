import { api, ApiError } from "../../../lib/api-client";
import { signInErrorText } from "../sign-in-errors";

/** GET /auth/csrf: a token that must come back with every POST to /auth (with its cookie). */
export async function getCsrfToken(): Promise<string> {
  const { csrfToken } = await api.get<{ csrfToken: string }>("/auth/csrf");
  return csrfToken;
}

/**
 * POST a form to an Auth.js action. `X-Auth-Return-Redirect` makes Auth.js answer `{url}`
 * instead of redirecting; a failure shows up as `?error=` on that url and is thrown here.
 */
export async function postAuthForm(path: string, fields: Record<string, string>): Promise<string> {
  const csrfToken = await getCsrfToken();
  const body = new URLSearchParams({ ...fields, csrfToken });
  const { url } = await api.post<{ url: string }>(path, body, {
    headers: { "X-Auth-Return-Redirect": "1" },
  });
  const code = authErrorCode(url);
  if (code) {
    const message =
      code === "CredentialsSignin" ? "That e-mail and password do not match." : signInErrorText(code).title + ".";
    throw new ApiError(401, code, message);
  }
  return url;
}

export function authErrorCode(url: string | undefined): string | null {
  if (!url) return null;
  try {
    return new URL(url, window.location.origin).searchParams.get("error");
  } catch {
    return null;
  }
}
