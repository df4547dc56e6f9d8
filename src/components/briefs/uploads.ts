/** Browser side of file uploads: one multipart POST per file with progress. */

export type UploadKind = 'schematic' | 'datasheet' | 'photo' | 'load-log' | 'other';

export interface UploadedFile {
  id: string;
  name: string;
  kind: UploadKind;
  mimeType: string;
  sizeBytes: number;
}

export function uploadFile(briefId: string, file: File, kind: UploadKind, onProgress: (fraction: number) => void): Promise<UploadedFile> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append('kind', kind);
    form.append('file', file, file.name);
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/v1/briefs/${briefId}/files`);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      let body: { message?: string; issues?: { message: string }[] } & Partial<UploadedFile> = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // fall through to the status-based message
      }
      if (xhr.status === 201) return resolve(body as UploadedFile);
      const reason =
        body.issues?.[0]?.message ??
        body.message ??
        (xhr.status === 413
          ? 'The file is larger than 10 MB.'
          : xhr.status === 415
            ? 'This kind of file is not accepted.'
            : `The upload failed (${xhr.status}).`);
      reject(new Error(reason));
    };
    xhr.onerror = () => reject(new Error('The connection dropped during the upload; try again.'));
    xhr.send(form);
  });
}

export function guessKind(file: File): UploadKind {
  const name = file.name.toLowerCase();
  if (name.endsWith('.csv') || name.endsWith('.txt')) return 'load-log';
  if (file.type.startsWith('image/')) return 'photo';
  if (name.endsWith('.pdf')) return 'datasheet';
  return 'other';
}
