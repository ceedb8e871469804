import type { ReactNode } from "react";

type Tone = "info" | "error" | "success" | "caution";

const tones: Record<Tone, string> = {
  info: "border-loch/40 bg-white",
  error: "border-madder bg-white",
  success: "border-moss bg-white",
  caution: "border-[#B7791F] bg-[#FFF8E6]",
};

export function Notice({ tone = "info", title, children }: { tone?: Tone; title?: string; children?: ReactNode }) {
  return (
    <div role={tone === "error" ? "alert" : "status"} className={`rounded-md border-l-4 p-4 ${tones[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className="mt-1 text-base">{children}</div> : null}
    </div>
  );
}
