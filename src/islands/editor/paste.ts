// What a paste or drop carries: image files go to the uploader; everything else is ProseMirror's to parse.

const imageType = /^image\//;

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
