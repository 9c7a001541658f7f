import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { z } from "zod";
import { machinePhotoSchema } from "@shared/machines/photos.ts";
import { api } from "@/lib/api-client.ts";
import { uploadWithProgress } from "@/lib/upload-with-progress.ts";
import { machinePhotoKeys } from "./machine-transfer-keys.ts";

export const getMachinePhotos = (machineId: number) =>
  api.get(`/machines/${machineId}/photos`, z.array(machinePhotoSchema));

export const machinePhotosQuery = (machineId: number) =>
  queryOptions({
    queryKey: machinePhotoKeys.ofMachine(machineId),
    queryFn: () => getMachinePhotos(machineId),
  });

export const useMachinePhotos = (machineId: number) => useQuery(machinePhotosQuery(machineId));

type AddPhoto = { machineId: number; file: File; caption: string; onProgress?: (f: number) => void };

export const addMachinePhoto = ({ machineId, file, caption, onProgress }: AddPhoto) => {
  const form = new FormData();
  if (caption.trim()) form.append("caption", caption.trim());
  form.append("file", file);
  return uploadWithProgress({
    path: `/machines/${machineId}/photos`,
    form,
    schema: machinePhotoSchema,
    ...(onProgress ? { onProgress } : {}),
  });
};

export const deleteMachinePhoto = ({ machineId, photoId }: { machineId: number; photoId: number }) =>
  api.send("DELETE", `/machines/${machineId}/photos/${photoId}`);

export function useAddMachinePhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addMachinePhoto,
    onSuccess: (_d, v) =>
      queryClient.invalidateQueries({ queryKey: machinePhotoKeys.ofMachine(v.machineId) }),
  });
}

export function useDeleteMachinePhoto() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteMachinePhoto,
    onSuccess: (_d, v) =>
      queryClient.invalidateQueries({ queryKey: machinePhotoKeys.ofMachine(v.machineId) }),
  });
}
