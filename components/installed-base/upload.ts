// fetch() reports no upload progress, so the wizard posts with XMLHttpRequest.
export function postForm<T>(
  url: string,
  form: FormData,
  onUpload: (fraction: number) => void,
): Promise<{ status: number; body: T }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.responseType = "json";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onUpload(e.loaded / e.total);
    };
    xhr.upload.onload = () => onUpload(1);
    xhr.onload = () => resolve({ status: xhr.status, body: xhr.response as T });
    xhr.onerror = () => reject(new Error("The upload failed; check the connection and try again"));
    xhr.send(form);
  });
}
