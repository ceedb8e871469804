"use client";
// Progress photos of one piece, one block per work stage: upload (the server checks the bytes and
// answers with a plain reason when it refuses), thumbnails through the download gate, and a
// "shared with the client" checkbox per photo.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useId, useState, type FormEvent } from "react";
import { PhotoGrid } from "@/components/journey/photo-grid";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { WORK_STAGE_LABELS, WORK_STAGES, type WorkStageName } from "@/lib/schemas/production";
import type { ProgressPhoto } from "@/lib/schemas/progress-photos";
import { api, ApiError } from "./api";

type Photo = ProgressPhoto & { kind: "progress" };

async function upload(pieceId: string, body: FormData): Promise<void> {
  const res = await fetch(`/api/production/pieces/${pieceId}/photos`, { method: "POST", body, cache: "no-store" });
  if (res.ok) return;
  const data = (await res.json().catch(() => ({}))) as { error?: { message?: string; fieldErrors?: Record<string, string[]> } };
  const field = data.error?.fieldErrors ? Object.values(data.error.fieldErrors)[0]?.[0] : undefined;
  throw new ApiError(res.status, field ?? data.error?.message ?? (res.status === 413 ? "That photo is too large." : `Upload failed (${res.status}).`));
}

export function PiecePhotos({ pieceId, initial }: { pieceId: string; initial: ProgressPhoto[] }) {
  const key = ["production", "piece", pieceId, "photos"];
  const q = useQuery({
    queryKey: key,
    queryFn: async () => (await api<{ photos: ProgressPhoto[] }>(`/api/production/pieces/${pieceId}/photos`)).photos,
    initialData: initial,
  });
  const photos: Photo[] = q.data.map((p) => ({ ...p, kind: "progress" }));
  return (
    <section aria-labelledby="photos-heading" className="mt-6 flex flex-col gap-4">
      <h2 id="photos-heading" className="text-xl">
        Progress photos
      </h2>
      <p className="text-bark">Photos stay within the studio unless you tick “shared with the client”. Location and camera details are removed on upload.</p>
      {WORK_STAGES.map((s) => (
        <StagePhotos key={s} pieceId={pieceId} stage={s} photos={photos.filter((p) => p.stage === s)} queryKey={key} />
      ))}
    </section>
  );
}

function StagePhotos({ pieceId, stage, photos, queryKey }: { pieceId: string; stage: WorkStageName; photos: Photo[]; queryKey: string[] }) {
  const qc = useQueryClient();
  const fileId = useId();
  const shareId = useId();
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const label = WORK_STAGE_LABELS[stage];
  const refresh = () => qc.invalidateQueries({ queryKey });

  const send = useMutation({
    mutationFn: (body: FormData) => upload(pieceId, body),
    onMutate: () => {
      setError(null);
      setDone(null);
    },
    onSuccess: async () => {
      setDone("Photo added.");
      await refresh();
    },
    onError: (e: Error) => setError(e.message),
  });
  const toggle = useMutation({
    mutationFn: (v: { id: string; shared: boolean }) => api(`/api/production/photos/${v.id}`, { method: "PATCH", body: { shared: v.shared } }),
    // The box shows the new state at once; it goes back (with the server's reason) if the change is refused.
    onMutate: (v) => {
      setError(null);
      qc.setQueryData<ProgressPhoto[]>(queryKey, (old) => old?.map((p) => (p.id === v.id ? { ...p, shared: v.shared } : p)));
    },
    onSettled: refresh,
    onError: (e: Error) => setError(e.message),
  });

  function onSubmit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const body = new FormData(formEl);
    const file = body.get("file");
    if (!(file instanceof File) || file.size === 0) {
      setError("Choose a photo to upload.");
      return;
    }
    body.set("stage", stage);
    send.mutate(body, { onSuccess: () => formEl.reset() });
  }

  return (
    <div className="rounded-lg border border-bark/20 bg-white p-4" data-testid={`photos-${stage}`}>
      <h3 className="mb-2 text-lg font-semibold">{label}</h3>
      <PhotoGrid
        photos={photos}
        label={`${label} photos`}
        empty={`No ${label.toLowerCase()} photos yet.`}
        extra={(p, i) => (
          <label className="mt-1 flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={p.shared}
              disabled={toggle.isPending}
              onChange={(e) => toggle.mutate({ id: p.id, shared: e.target.checked })}
              aria-label={`${label} photo ${i + 1}: shared with the client`}
            />
            <span aria-hidden="true">Shared with the client</span>
          </label>
        )}
      />
      <form onSubmit={onSubmit} className="mt-3 flex flex-wrap items-end gap-3" encType="multipart/form-data">
        <div className="flex flex-col">
          <label htmlFor={fileId} className="font-semibold">
            Add a {label.toLowerCase()} photo
          </label>
          <input id={fileId} name="file" type="file" accept="image/jpeg,image/png,image/webp" className="max-w-full text-base" />
        </div>
        <label htmlFor={shareId} className="flex items-center gap-2">
          <input id={shareId} name="shared" type="checkbox" />
          Share with the client
        </label>
        <Button type="submit" disabled={send.isPending}>
          {send.isPending ? "Uploading…" : "Upload photo"}
        </Button>
      </form>
      <div className="mt-2" aria-live="polite">
        {error ? <Notice tone="error">{error}</Notice> : done ? <p>{done}</p> : null}
      </div>
    </div>
  );
}
