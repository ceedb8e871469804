import type { ReactNode } from "react";

/** Thumbnails through the download gate; `extra` adds something under each (e.g. a share toggle). */
export function PhotoGrid<P extends { id: string; kind: string }>({
  photos,
  label,
  extra,
  empty = "No photos yet.",
}: {
  photos: P[];
  label: string;
  extra?: (photo: P, index: number) => ReactNode;
  empty?: string;
}) {
  if (!photos.length) return <p className="text-bark">{empty}</p>;
  return (
    <ul className="flex flex-wrap gap-3" aria-label={label}>
      {photos.map((p, i) => (
        <li key={p.id}>
          <a href={`/api/uploads/${p.id}`}>
            {/* eslint-disable-next-line @next/next/no-img-element */}
            <img src={`/api/uploads/${p.id}?size=thumb`} alt={`${p.kind === "progress" ? "Progress" : "Reference"} photo ${i + 1}`} className="h-28 w-28 rounded-md border border-bark/30 object-cover" />
          </a>
          {extra ? extra(p, i) : null}
        </li>
      ))}
    </ul>
  );
}
