export function PhotoGrid({ photos, label }: { photos: { id: string; kind: string }[]; label: string }) {
  if (!photos.length) return <p className="text-bark">No photos yet.</p>;
  return (
    <ul className="flex flex-wrap gap-3" aria-label={label}>
      {photos.map((p, i) => (
        <li key={p.id}>
          <a href={`/api/uploads/${p.id}`}>
            {/* eslint-disable-next-line @next/next/no-img-element */}
            <img src={`/api/uploads/${p.id}?size=thumb`} alt={`${p.kind === "progress" ? "Progress" : "Reference"} photo ${i + 1}`} className="h-28 w-28 rounded-md border border-bark/30 object-cover" />
          </a>
        </li>
      ))}
    </ul>
  );
}
