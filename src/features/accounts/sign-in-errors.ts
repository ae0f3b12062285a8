/** Words for the error codes Auth.js puts in `?error=` (its documented sign-in error types). */
export type SignInErrorText = { title: string; body: string };

export const signInErrorTexts: Record<string, SignInErrorText> = {
  Verification: {
    title: "That sign-in link has expired or was already used",
    body: "Each link works once, for 10 minutes. Ask for a new one and use the newest mail.",
  },
  CredentialsSignin: {
    title: "That e-mail and password do not match",
    body: "Check both and try again, or have a sign-in link e-mailed to you instead.",
  },
  AccessDenied: {
    title: "This account cannot sign in right now",
    body: "Signing in was refused. If you think this is a mistake, contact the Blendwell team.",
  },
  Configuration: {
    title: "Signing in is not working on our side",
    body: "Something is wrong with the server's sign-in set-up. Please try again later.",
  },
  EmailSignin: {
    title: "We could not send the sign-in mail",
    body: "Please check the address and try again in a moment.",
  },
};

export const defaultSignInErrorText: SignInErrorText = {
  title: "Signing in did not work",
  body: "Something went wrong while signing you in. Please try again.",
};

export function signInErrorText(code: string | null | undefined): SignInErrorText {
  return (code && signInErrorTexts[code]) || defaultSignInErrorText;
}
