// Photos are made smaller on the phone before they are kept and sent: a phone camera's
// 4000-pixel picture is several megabytes, which a weak signal may never finish sending.
// The canvas API scales it to at most 1600 pixels on the long side as a JPEG (quality
// 0.8, usually 200-400 KB), enough to see colonies on a pallet and a drop site.
export const maxPhotoEdge = 1600;
const quality = 0.8;

export async function resizePhoto(file: Blob): Promise<Blob> {
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  } catch {
    return file; // Not decodable here: kept as taken; the server checks what it is.
  }
  const scale = Math.min(1, maxPhotoEdge / Math.max(bitmap.width, bitmap.height));
  const width = Math.max(1, Math.round(bitmap.width * scale));
  const height = Math.max(1, Math.round(bitmap.height * scale));
  const canvas = document.createElement('canvas');
  canvas.width = width;
  canvas.height = height;
  canvas.getContext('2d')!.drawImage(bitmap, 0, 0, width, height);
  bitmap.close();
  const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/jpeg', quality));
  return blob ?? file;
}
