// Mail of the commission journey: a request, proofs and their answers, messages.
import { renderEmail } from "./layout";

interface StudioLook {
  name: string;
  brandHex: string;
}

const footer = (studio: StudioLook) => `Sent by Darnwell on behalf of ${studio.name}.`;

export function requestToStudioMessage(studio: StudioLook, p: { clientName: string; number: number; title: string; url: string }) {
  return renderEmail({
    subject: `New request no. ${p.number}: ${p.title}`,
    heading: "A new commission request",
    paragraphs: [
      `${p.clientName} has sent a request: ${p.title} (no. ${p.number}).`,
      "Open it to read the brief, look at the reference photos and start a quote.",
    ],
    action: { label: "Open the request", url: p.url },
    footer: footer(studio),
    accentHex: studio.brandHex,
  });
}

export function requestToClientMessage(studio: StudioLook, p: { clientName: string; number: number; title: string; url: string; leadTimeWeeks: number }) {
  return renderEmail({
    subject: `${studio.name} has your request: ${p.title}`,
    heading: "Thank you for your request",
    paragraphs: [
      `Hello ${p.clientName},`,
      `${studio.name} has received your request "${p.title}" (no. ${p.number}). They will read it and send you a quote; you can follow it and send them a message at any time.`,
      `Their current lead time is about ${p.leadTimeWeeks} weeks from your approval of the chart.`,
    ],
    action: { label: "Follow my commission", url: p.url },
    footer: footer(studio),
    accentHex: studio.brandHex,
  });
}

export function proofReadyMessage(studio: StudioLook, p: { clientName: string; number: number; title: string; url: string; note: string }) {
  return renderEmail({
    subject: `Proof ${p.number} of your ${p.title} is ready to check`,
    heading: "Your chart is ready to check",
    paragraphs: [
      `Hello ${p.clientName},`,
      `${studio.name} has sent proof ${p.number} of "${p.title}". The knitted preview is attached; the proof page shows every chart with its symbols, the colours by name and the lettering at its real size.`,
      ...(p.note ? [`Their note: ${p.note}`] : []),
      "Approve it when it is right, or ask for changes and pin your comments to the stitches you mean. Nothing is knitted before you approve.",
    ],
    action: { label: "Check the proof", url: p.url },
    footer: footer(studio),
    accentHex: studio.brandHex,
  });
}

export function proofAnsweredMessage(
  studio: StudioLook,
  p: { clientName: string; proofNumber: number; title: string; url: string; approved: boolean; note: string; pinned: number },
) {
  return renderEmail({
    subject: p.approved ? `${p.clientName} approved proof ${p.proofNumber} of ${p.title}` : `${p.clientName} asked for changes to proof ${p.proofNumber}`,
    heading: p.approved ? "Proof approved" : "Changes asked",
    paragraphs: p.approved
      ? [`${p.clientName} approved proof ${p.proofNumber} of "${p.title}". That design version is now locked; production can start.`]
      : [
          `${p.clientName} asked for changes to proof ${p.proofNumber} of "${p.title}"${p.pinned ? `, with ${p.pinned} comment${p.pinned === 1 ? "" : "s"} pinned to stitches` : ""}.`,
          ...(p.note ? [`Their note: ${p.note}`] : []),
        ],
    action: { label: "Open the commission", url: p.url },
    footer: footer(studio),
    accentHex: studio.brandHex,
  });
}

export function newMessageMessage(studio: StudioLook, p: { fromName: string; title: string; excerpt: string; url: string }) {
  return renderEmail({
    subject: `New message about ${p.title}`,
    heading: `${p.fromName} wrote`,
    paragraphs: [`About "${p.title}":`, p.excerpt, "Reply on the commission page so everything stays in one thread."],
    action: { label: "Read and reply", url: p.url },
    footer: footer(studio),
    accentHex: studio.brandHex,
  });
}
