/** Offering something made in the browser as a file download. */

/** Offers `blob` as a download named `fileName`, through a short-lived object address. */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  link.style.display = 'none';
  document.body.append(link);
  link.click();
  link.remove();
  // Give the browser time to start the download before the address is released.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** A file name safe on every system: letters, digits, dot, dash and underscore. */
export function safeFilename(name: string): string {
  return name.replace(/[^A-Za-z0-9_.-]+/g, '-').replace(/^-+|-+$/g, '') || 'export';
}
