// Plain, accessible e-mail markup shared by every message: one column, real text, a link that
// also appears in full in the text part.
export interface EmailParts {
  subject: string;
  heading: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  footer?: string;
  accentHex?: string;
}

const escape = (s: string) =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

export function renderEmail(parts: EmailParts): { subject: string; html: string; text: string } {
  const accent = parts.accentHex ?? "#A3342A";
  const footer = parts.footer ?? "Sent by Darnwell on behalf of your knitting studio.";
  const html = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width">
<title>${escape(parts.subject)}</title></head>
<body style="margin:0;background:#FBF8F2;color:#2B2622;font-family:Verdana,Arial,sans-serif;font-size:16px;line-height:1.5">
<div role="article" aria-label="${escape(parts.subject)}" style="max-width:560px;margin:0 auto;padding:24px">
<h1 style="font-family:Georgia,serif;font-size:24px;color:${accent};margin:0 0 16px">${escape(parts.heading)}</h1>
${parts.paragraphs.map((p) => `<p style="margin:0 0 12px">${escape(p)}</p>`).join("\n")}
${
  parts.action
    ? `<p style="margin:24px 0"><a href="${escape(parts.action.url)}" style="background:${accent};color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;display:inline-block">${escape(parts.action.label)}</a></p>
<p style="margin:0 0 12px;font-size:14px">Or paste this address into your browser:<br><a href="${escape(parts.action.url)}" style="color:${accent};word-break:break-all">${escape(parts.action.url)}</a></p>`
    : ""
}
<p style="margin:32px 0 0;font-size:13px;color:#5A4F45">${escape(footer)}</p>
</div></body></html>`;
  const text = [
    parts.heading,
    "",
    ...parts.paragraphs.flatMap((p) => [p, ""]),
    ...(parts.action ? [`${parts.action.label}: ${parts.action.url}`, ""] : []),
    "--",
    footer,
  ].join("\n");
  return { subject: parts.subject, html, text };
}
