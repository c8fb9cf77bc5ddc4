// What a paste or drop carries: image files go to the uploader; everything else is ProseMirror's to parse.

const imageType = /^image\//;
// Office suites mark their clipboard HTML with their namespace, Mso classes and mso- styles.
const officeHtml = /urn:schemas-microsoft-com:office|class="?Mso|mso-/i;

export function imageFilesOf(data: DataTransfer | null | undefined): File[] {
  if (!data) return [];
  const files = Array.from(data.files ?? []).filter((f) => imageType.test(f.type));
  if (files.length > 0) return files;
  // Some browsers put a pasted screenshot in items only.
  return Array.from(data.items ?? [])
    .filter((item) => item.kind === 'file' && imageType.test(item.type))
    .map((item) => item.getAsFile())
    .filter((f): f is File => f !== null);
}

/** Image files a paste into the remedy should upload; none when the paste is office-suite text. */
export function pastedImageFiles(data: DataTransfer | null | undefined): File[] {
  // Office suites put a picture of the copied text beside its HTML; taking it would lose the text itself.
  if (data && /\S/.test(data.getData('text/plain')) && officeHtml.test(data.getData('text/html'))) return [];
  return imageFilesOf(data);
}
