/** Photos of a real installation's wiring, attached to one part of a plan. */
import { z } from 'zod';

export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;

export const PlanPhotoSchema = z.object({
  id: z.string(),
  partId: z.string(),
  caption: z.string(),
  width: z.number().int(),
  height: z.number().int(),
  createdAt: z.string(),
  /** The picture and its thumbnail, served only to people who may see the plan. */
  url: z.string(),
  thumbUrl: z.string(),
});
export type PlanPhoto = z.infer<typeof PlanPhotoSchema>;

export const PlanPhotoListSchema = z.object({ items: z.array(PlanPhotoSchema) });
export type PlanPhotoList = z.infer<typeof PlanPhotoListSchema>;

export const PhotoCaptionSchema = z.string().trim().max(200, 'Keep captions to 200 characters').default('');

export const PhotoUploadFieldsSchema = z.object({
  partId: z.string().min(1, 'Say which part the photo shows').max(40),
  caption: PhotoCaptionSchema,
});

export const PhotoUpdateSchema = z.object({ caption: PhotoCaptionSchema });
export type PhotoUpdate = z.infer<typeof PhotoUpdateSchema>;

export const PhotoListQuerySchema = z.object({ part: z.string().min(1).max(40).optional() });

export const PhotoParamsSchema = z.object({
  id: z.string().min(1).max(64),
  photoId: z.string().min(1).max(64),
});
