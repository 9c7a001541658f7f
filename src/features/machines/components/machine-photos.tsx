import { useRef, useState } from "react";
import { MAX_PHOTOS_PER_MACHINE } from "@shared/machines/photos.ts";
import { env } from "@/config/env.ts";
import { Button } from "@/components/ui/button.tsx";
import { FormError } from "@/components/ui/form-error.tsx";
import { Spinner } from "@/components/ui/spinner.tsx";
import { TextField } from "@/components/ui/text-field.tsx";
import { useAddMachinePhoto, useDeleteMachinePhoto, useMachinePhotos } from "../api/machine-photos.ts";

const photoSrc = (machineId: number, photoId: number) =>
  `${env.VITE_API_BASE}/machines/${machineId}/photos/${photoId}`;

/** The machine's photos (nameplate, control, the machine in its bay): add one from a phone, remove one. */
export function MachinePhotos({ machineId }: { machineId: number }) {
  const photos = useMachinePhotos(machineId);
  const add = useAddMachinePhoto();
  const remove = useDeleteMachinePhoto();
  const [file, setFile] = useState<File | null>(null);
  const [caption, setCaption] = useState("");
  const [progress, setProgress] = useState<number | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const list = photos.data ?? [];
  const full = list.length >= MAX_PHOTOS_PER_MACHINE;

  return (
    <section aria-labelledby="machine-photos-heading" className="space-y-4">
      <h2 id="machine-photos-heading" className="text-lg font-semibold text-ink-900">
        Photos
      </h2>
      {photos.isPending && <Spinner label="Loading photos" />}
      <FormError error={photos.error ?? remove.error} />
      {photos.isSuccess && list.length === 0 && (
        <p className="text-sm text-ink-700">
          No photos yet. A photo of the nameplate helps a technician prepare.
        </p>
      )}
      {list.length > 0 && (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          {list.map((photo) => (
            <li key={photo.id} className="min-w-0 rounded-md border border-ink-200 bg-white p-2">
              <a href={photoSrc(machineId, photo.id)} target="_blank" rel="noreferrer">
                <img
                  src={photoSrc(machineId, photo.id)}
                  alt={
                    photo.caption ?? `Machine photo added ${new Date(photo.createdAt).toLocaleDateString()}`
                  }
                  width={photo.width}
                  height={photo.height}
                  loading="lazy"
                  className="aspect-[4/3] h-auto w-full rounded object-cover"
                />
              </a>
              {photo.caption && <p className="mt-1 break-words text-sm text-ink-800">{photo.caption}</p>}
              <Button
                variant="quiet"
                className="mt-1 w-full"
                pending={remove.isPending && remove.variables?.photoId === photo.id}
                pendingLabel="Removing…"
                onClick={() => {
                  if (window.confirm("Remove this photo? It cannot be brought back."))
                    remove.mutate({ machineId, photoId: photo.id });
                }}
              >
                Remove<span className="sr-only"> photo {photo.caption ?? photo.id}</span>
              </Button>
            </li>
          ))}
        </ul>
      )}
      {full ? (
        <p className="text-sm text-ink-700">
          This machine has {MAX_PHOTOS_PER_MACHINE} photos, the most it keeps. Remove one to add another.
        </p>
      ) : (
        <form
          className="space-y-3 rounded-md border border-ink-200 bg-ink-50 p-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (!file) return;
            setProgress(0);
            add.mutate(
              { machineId, file, caption, onProgress: setProgress },
              {
                onSuccess: () => {
                  setFile(null);
                  setCaption("");
                  if (input.current) input.current.value = "";
                },
                onSettled: () => setProgress(null),
              },
            );
          }}
        >
          <label className="block text-sm font-medium text-ink-900">
            Photo (JPEG or PNG, up to 10 MB)
            <input
              ref={input}
              type="file"
              name="file"
              accept="image/jpeg,image/png"
              className="mt-1 block w-full max-w-full text-sm"
              onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            />
          </label>
          <TextField
            label="Caption (optional)"
            name="caption"
            value={caption}
            maxLength={200}
            onChange={(e) => setCaption(e.target.value)}
          />
          <p className="text-xs text-ink-700">
            Photos are shrunk to 1,600 pixels and saved without their location or camera details.
          </p>
          <FormError error={add.error} />
          <Button type="submit" disabled={!file} pending={add.isPending} pendingLabel="Uploading…">
            Add photo
          </Button>
          {progress !== null && (
            <progress className="block w-full" max={1} value={progress} aria-label="Upload progress" />
          )}
        </form>
      )}
    </section>
  );
}
