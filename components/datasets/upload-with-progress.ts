/**
 * POSTs a multipart form with XMLHttpRequest, because fetch cannot report upload progress. Resolves
 * with the status and the JSON body (null when there is none); rejects only when the request never
 * reached the server.
 */
export function uploadWithProgress<T>(
  url: string,
  form: FormData,
  onProgress: (fraction: number) => void,
): Promise<{ status: number; body: T | null }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.responseType = "json";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new Error("network"));
    xhr.onload = () => resolve({ status: xhr.status, body: (xhr.response as T | null) ?? null });
    xhr.send(form);
  });
}
