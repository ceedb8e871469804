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
