import type { ReactNode } from "react";

export function Card({ children, className = "" }: { children: ReactNode; className?: string }) {
  return <section className={`rounded-lg border border-bark/20 bg-white p-5 shadow-sm ${className}`}>{children}</section>;
}

export function PageTitle({ title, lead }: { title: string; lead?: ReactNode }) {
  return (
    <header className="mb-6">
      <h1 className="text-3xl text-peat">{title}</h1>
      {lead ? <p className="mt-2 max-w-prose text-lg text-bark">{lead}</p> : null}
    </header>
  );
}
