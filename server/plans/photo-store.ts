/**
 * The photo folder: pictures are recognised by their content (file-type), re-encoded with sharp so every
 * piece of metadata (camera, place, time) is dropped, and written under random names with a thumbnail.
 */
import { randomBytes } from 'node:crypto';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { fileTypeFromBuffer } from 'file-type';
import sharp, { type OutputInfo } from 'sharp';
import { PHOTO_TYPES } from '../../shared/schemas/plan-photos.schema';
import { HttpError } from '../http/http-error';

/** Long side of a stored photo and of its thumbnail, in pixels. */
export const PHOTO_LONG_SIDE = 2560;
export const THUMB_LONG_SIDE = 320;

const EXTENSIONS: Record<(typeof PHOTO_TYPES)[number], 'jpeg' | 'png' | 'webp'> = {
  'image/jpeg': 'jpeg',
  'image/png': 'png',
  'image/webp': 'webp',
};

export interface StoredPhoto {
  fileName: string;
  thumbName: string;
  mime: string;
  width: number;
  height: number;
  byteSize: number;
}

const isPhotoType = (mime: string | undefined): mime is (typeof PHOTO_TYPES)[number] =>
  (PHOTO_TYPES as readonly string[]).includes(mime ?? '');

export function photoStore(dir: string) {
  const path = (name: string) => join(dir, name);
  const randomName = (ext: string) => `${randomBytes(16).toString('hex')}.${ext}`;

  return {
    path,

    async save(buffer: Buffer): Promise<StoredPhoto> {
      const type = await fileTypeFromBuffer(buffer);
      if (!isPhotoType(type?.mime)) {
        throw new HttpError(400, 'VALIDATION_FAILED', 'That file is not a JPEG, PNG or WebP picture.', {
          file: [
            `The file's content is ${type ? type.mime : 'not a picture format we know'}; use JPEG, PNG or WebP.`,
          ],
        });
      }
      const format = EXTENSIONS[type.mime];
      let photo: { data: Buffer; info: OutputInfo };
      let thumb: Buffer;
      try {
        // rotate() turns the picture upright by its orientation tag before the tags are dropped.
        const image = sharp(buffer, { failOn: 'error' }).rotate();
        photo = await image
          .clone()
          .resize({
            width: PHOTO_LONG_SIDE,
            height: PHOTO_LONG_SIDE,
            fit: 'inside',
            withoutEnlargement: true,
          })
          .toFormat(format)
          .toBuffer({ resolveWithObject: true });
        thumb = await image
          .clone()
          .resize({
            width: THUMB_LONG_SIDE,
            height: THUMB_LONG_SIDE,
            fit: 'inside',
            withoutEnlargement: true,
          })
          .webp()
          .toBuffer();
      } catch {
        throw new HttpError(400, 'VALIDATION_FAILED', 'That picture is damaged and cannot be read.', {
          file: ['The picture could not be decoded.'],
        });
      }
      await mkdir(dir, { recursive: true });
      const fileName = randomName(format === 'jpeg' ? 'jpg' : format);
      const thumbName = randomName('webp');
      await writeFile(path(fileName), photo.data);
      await writeFile(path(thumbName), thumb);
      return {
        fileName,
        thumbName,
        mime: type.mime,
        width: photo.info.width,
        height: photo.info.height,
        byteSize: photo.data.length + thumb.length,
      };
    },

    async remove(names: string[]): Promise<void> {
      await Promise.all(names.map((name) => rm(path(name), { force: true })));
    },
  };
}

export type PhotoStore = ReturnType<typeof photoStore>;
