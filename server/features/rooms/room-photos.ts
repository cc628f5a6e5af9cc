// Room photos are re-encoded on the server: a large copy for the room page and a thumbnail for lists.
// Re-encoding (rather than storing the upload) drops camera metadata such as GPS positions, turns the
// picture upright from its orientation tag, and means no uploaded byte is ever served back.
import sharp from 'sharp';
import { ROOM_PHOTO_SIZES } from '@shared/schemas/rooms';

/** Refuse decompression bombs: a 10 MB file can claim gigapixels. 50 MP is more than any phone takes. */
const MAX_INPUT_PIXELS = 50_000_000;

export type PhotoVariants = { large: Buffer; thumb: Buffer; width: number; height: number };

export class UnreadableImageError extends Error {}

export async function makePhotoVariants(path: string): Promise<PhotoVariants> {
  try {
    const base = () => sharp(path, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).rotate();
    const large = await base()
      .resize({ width: ROOM_PHOTO_SIZES.large, height: ROOM_PHOTO_SIZES.large, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 82 })
      .toBuffer({ resolveWithObject: true });
    const thumb = await base()
      .resize({ width: ROOM_PHOTO_SIZES.thumb, height: ROOM_PHOTO_SIZES.thumb, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 75 })
      .toBuffer();
    return { large: large.data, thumb, width: large.info.width, height: large.info.height };
  } catch (error) {
    throw new UnreadableImageError(error instanceof Error ? error.message : String(error));
  }
}
