import { renderEmail } from "./layout";

export function shippedMessage(p: {
  studioName: string;
  clientName: string;
  title: string;
  carrier: string;
  tracking: string;
  commissionUrl: string;
  careCardUrl: string;
  accentHex?: string;
}) {
  return renderEmail({
    subject: `${p.title} is on its way`,
    heading: "Your knitting is on its way",
    paragraphs: [
      `Hello ${p.clientName},`,
      `${p.studioName} has sent "${p.title}" with ${p.carrier}. Tracking number: ${p.tracking}.`,
      `A care card comes with the piece; you can also download it at any time: ${p.careCardUrl}`,
      "When it arrives, please confirm delivery from your commission page.",
    ],
    action: { label: "Open my commission", url: p.commissionUrl },
    accentHex: p.accentHex,
  });
}
