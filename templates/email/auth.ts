import { renderEmail } from "./layout";

export function verifyEmailMessage(name: string, url: string) {
  return renderEmail({
    subject: "Confirm your e-mail address for Darnwell",
    heading: "Confirm your e-mail address",
    paragraphs: [
      `Hello ${name},`,
      "Please confirm this is your address so your studio can reach you about your commission. The link works for 24 hours.",
      "If you did not sign up, you can ignore this message.",
    ],
    action: { label: "Confirm my address", url },
  });
}

export function resetPasswordMessage(name: string, url: string) {
  return renderEmail({
    subject: "Reset your Darnwell password",
    heading: "Choose a new password",
    paragraphs: [
      `Hello ${name},`,
      "Someone (we hope you) asked to reset the password for this address. The link works for one hour and only once.",
      "If it was not you, ignore this message: your password stays as it is.",
    ],
    action: { label: "Choose a new password", url },
  });
}

/** Sent instead of a confirmation when someone signs up with an address that already has an account. */
export function existingAccountSignUpMessage(name: string, signInUrl: string, resetUrl: string) {
  return renderEmail({
    subject: "Someone tried to sign up to Darnwell with your address",
    heading: "You already have an account",
    paragraphs: [
      `Hello ${name},`,
      "Someone (we hope you) just tried to open a new Darnwell account with this e-mail address. This address already has an account, so no new one was made and nothing about your account changed.",
      `If it was you, sign in instead: ${signInUrl}. Forgotten your password? Choose a new one with the button below.`,
      "If it was not you, you can ignore this message.",
    ],
    action: { label: "Choose a new password", url: resetUrl },
  });
}

export function magicLinkMessage(url: string) {
  return renderEmail({
    subject: "Your Darnwell sign-in link",
    heading: "Sign in to Darnwell",
    paragraphs: [
      "Use the button below to sign in. The link works for 10 minutes and only once.",
      "If you did not ask for it, ignore this message.",
    ],
    action: { label: "Sign me in", url },
  });
}

export function invitationMessage(studioName: string, inviterName: string, url: string) {
  return renderEmail({
    subject: `${inviterName} invited you to ${studioName} on Darnwell`,
    heading: `Join ${studioName}`,
    paragraphs: [
      `${inviterName} has invited you to help at ${studioName} as an assistant: you will see the studio's commissions, move pieces between stages and log your hours.`,
      "The invitation works for 7 days and only once.",
    ],
    action: { label: "Accept the invitation", url },
  });
}

/** Sent once per lock when wrong passwords for this address keep arriving. */
export function signInLockedMessage(name: string, minutes: number, resetUrl: string) {
  return renderEmail({
    subject: "Password sign-in to your Darnwell account is paused",
    heading: "Several wrong passwords were tried",
    paragraphs: [
      `Hello ${name},`,
      `Someone tried to sign in to your account with wrong passwords several times, so signing in with a password is paused for ${minutes} minute${minutes === 1 ? "" : "s"}. Each further wrong password pauses it for longer.`,
      "If it was you, wait and try again, or sign in with an e-mail link instead. If it was not you, your account is safe as long as your password is not used elsewhere; choosing a new one is a good idea.",
    ],
    action: { label: "Choose a new password", url: resetUrl },
  });
}
