import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  AttachmentListSchema,
  AttachmentSchema,
  type Attachment,
  type AttachmentKind,
  type AttachmentOwnerType,
  type AttachmentUpdate,
} from '@/shared/schemas/attachment';
import { api, type UploadProgress } from './api-client';
import { filePart, type PickedFile } from './file-part';

export interface AttachmentOwner {
  ownerType: AttachmentOwnerType;
  ownerId: string;
}

export interface AttachmentFilter extends AttachmentOwner {
  kind?: AttachmentKind;
  page?: number;
  pageSize?: number;
}

export const attachmentKeys = {
  all: ['attachments'] as const,
  owner: (o: AttachmentOwner) => [...attachmentKeys.all, 'owner', o.ownerType, o.ownerId] as const,
  list: (f: AttachmentFilter) =>
    [...attachmentKeys.owner(f), 'list', { kind: f.kind ?? null, page: f.page ?? 1, pageSize: f.pageSize ?? 50 }] as const,
};

/** Where the browser loads an attachment's bytes from (same origin; the session cookie goes with it). */
export const attachmentContentUrl = (id: string) => `/api/v1/attachments/${id}/content`;

const Single = z.object({ attachment: AttachmentSchema });

export const attachmentsQuery = (f: AttachmentFilter) =>
  queryOptions({
    queryKey: attachmentKeys.list(f),
    queryFn: () => {
      const q = new URLSearchParams({
        ownerType: f.ownerType,
        ownerId: f.ownerId,
        page: String(f.page ?? 1),
        pageSize: String(f.pageSize ?? 50),
        ...(f.kind && { kind: f.kind }),
      });
      return api.get(`/v1/attachments?${q.toString()}`, AttachmentListSchema);
    },
    placeholderData: keepPreviousData,
  });

export function useAttachments(f: AttachmentFilter) {
  return useQuery(attachmentsQuery(f));
}

export interface UploadInput extends AttachmentOwner {
  kind: AttachmentKind;
  file: PickedFile;
  caption?: string;
  bearingDeg?: number | null;
  onProgress?: UploadProgress;
  signal?: AbortSignal;
}

/** Uploads one file with progress; on success every list of that owner is refetched. */
export function useUploadAttachment() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ file, onProgress, signal, ...fields }: UploadInput) => {
      const form = new FormData();
      // Text fields first: the server reads them before the file arrives.
      form.append('ownerType', fields.ownerType);
      form.append('ownerId', fields.ownerId);
      form.append('kind', fields.kind);
      form.append('caption', fields.caption ?? '');
      if (fields.bearingDeg != null) form.append('bearingDeg', String(fields.bearingDeg));
      form.append('file', filePart(file) as Blob, file.name);
      return (await api.upload('/v1/attachments', form, Single, onProgress, signal)).attachment;
    },
    onSuccess: (a) => qc.invalidateQueries({ queryKey: attachmentKeys.owner(a) }),
  });
}

export function useUpdateAttachment() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, ...input }: AttachmentUpdate & { id: string }) =>
      (await api.patch(`/v1/attachments/${id}`, input, Single)).attachment,
    onSuccess: (a) => qc.invalidateQueries({ queryKey: attachmentKeys.owner(a) }),
  });
}

export function useDeleteAttachment() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (a: Pick<Attachment, 'id' | 'ownerType' | 'ownerId'>) => api.delete(`/v1/attachments/${a.id}`),
    onSuccess: (_none, a) => qc.invalidateQueries({ queryKey: attachmentKeys.owner(a) }),
  });
}
