"use client";
// Uploads with progress (fetch cannot report upload progress; XMLHttpRequest can).
export interface UploadAnswer {
  status: number;
  body: unknown;
}

export function uploadFile(url: string, file: File, onProgress: (fraction: number) => void, fields: Record<string, string> = {}): Promise<UploadAnswer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.responseType = "json";
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onload = () => resolve({ status: xhr.status, body: xhr.response as unknown });
    xhr.onerror = () => reject(new Error("The upload did not reach the server. Check the connection and try again."));
    const form = new FormData();
    for (const [k, v] of Object.entries(fields)) form.append(k, v);
    form.append("file", file);
    xhr.send(form);
  });
}

/** The message of an error answer from our API, or a plain fallback. */
/** A copyright caution shown wherever charts or parts are uploaded. */
export const RIGHTS_CAUTION =
  "Upload only charts your band owns or is licensed to share. Copyright rules differ from place to place; when in doubt, check the licence of the music.";
