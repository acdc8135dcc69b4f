import { uploadLimitBytes, uploadLimitText } from '@shared/api/uploads';

// The largest file the server takes is checked here first, so that nothing is sent in vain.

/** A file size as a person reads it: 812 bytes, 14.2 kB, 3.1 MB. */
export function fileSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
}

/** Why a file cannot be sent as it is (too large, or empty), or null when it can. */
export function uploadFault(file: File): string | null {
  if (file.size > uploadLimitBytes) {
    return `“${file.name}” is ${fileSize(file.size)}, larger than the limit of ${uploadLimitText}, so it was not sent. Choose a smaller file.`;
  }
  if (file.size === 0) return `“${file.name}” is empty. Choose another file.`;
  return null;
}
