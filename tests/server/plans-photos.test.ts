/** Photos of a part's wiring: recognised by content, metadata dropped, thumbnails made, served to viewers only. */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ErrorBodySchema } from '../../shared/schemas/error.schema';
import { PlanPhotoListSchema, PlanPhotoSchema } from '../../shared/schemas/plan-photos.schema';
import type { PlanRecord } from '../../shared/schemas/plans.schema';
import { planWithSets, signedInAgent, startTestServer, type TestServer } from './server.harness';
import { createPlan, photoJpeg, photoPng, type Agent } from './plans-fixtures';

let server: TestServer;
let owner: Agent;
let plan: PlanRecord;
const MAX = 200_000;

beforeAll(async () => {
  server = await startTestServer({ PHOTO_MAX_BYTES: String(MAX) });
  owner = (await signedInAgent(server)).agent;
  plan = await createPlan(owner, planWithSets(2, 'Photo bench'));
});
afterAll(async () => {
  await server.close();
});

const errorOf = (body: unknown) => ErrorBodySchema.parse(body).error;
const upload = (file: Buffer, name: string, partId = 'set-1', caption = '') =>
  owner
    .post(`/api/plans/${plan.id}/photos`)
    .field('partId', partId)
    .field('caption', caption)
    .attach('file', file, name);

describe('photos', () => {
  it('takes a JPEG, drops its EXIF, makes a thumbnail and keeps it under a random name beside the database', async () => {
    const original = await photoJpeg();
    expect((await sharp(original).metadata()).exif).toBeDefined();
    const res = await upload(original, 'IMG_0042.jpg', 'set-1', 'Cord entry, 25-pair');
    expect(res.status).toBe(201);
    const photo = PlanPhotoSchema.parse(res.body);
    expect(photo).toMatchObject({ partId: 'set-1', caption: 'Cord entry, 25-pair', width: 800, height: 600 });

    const image = await owner.get(photo.url);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    const meta = await sharp(image.body as Buffer).metadata();
    expect(meta.exif).toBeUndefined(); // sharp drops metadata unless asked to keep it (sharp output docs)
    expect(meta.format).toBe('jpeg');

    const thumb = await owner.get(photo.thumbUrl);
    const thumbMeta = await sharp(thumb.body as Buffer).metadata();
    expect([thumbMeta.format, thumbMeta.width, thumbMeta.height]).toEqual(['webp', 320, 240]);

    const files = readdirSync(join(server.dir, 'photos'));
    expect(files.some((f) => f.includes('IMG_0042'))).toBe(false);
    expect(files.every((f) => /^[0-9a-f]{32}\.(jpg|webp|png)$/.test(f))).toBe(true);
  });

  it('recognises a PNG by its content, and refuses a text file named .png', async () => {
    expect((await upload(await photoPng(), 'scan.bin', 'ksu')).status).toBe(201);
    const fake = await upload(Buffer.from('this is not a picture, only words'), 'wiring.png');
    expect(fake.status).toBe(400);
    expect(errorOf(fake.body).message).toBe('That file is not a JPEG, PNG or WebP picture.');
  });

  it('refuses an upload over the size limit, a part not in the plan, and a missing file', async () => {
    const big = Buffer.concat([await photoPng(), Buffer.alloc(MAX)]);
    const tooBig = await upload(big, 'big.png');
    expect(tooBig.status).toBe(413);
    const noPart = await upload(await photoPng(), 'p.png', 'set-9');
    expect(noPart.status).toBe(400);
    expect(errorOf(noPart.body).details?.partId).toEqual(['No part "set-9" in the plan']);
    const none = await owner.post(`/api/plans/${plan.id}/photos`).field('partId', 'set-1');
    expect(none.status).toBe(400);
  });

  it('lists by part, changes captions and deletes with the files', async () => {
    const photo = PlanPhotoSchema.parse(
      (await upload(await photoPng(), 'adapter.png', 'set-2', 'Before')).body,
    );
    const listed = PlanPhotoListSchema.parse(
      (await owner.get(`/api/plans/${plan.id}/photos?part=set-2`)).body,
    );
    expect(listed.items.map((p) => p.id)).toEqual([photo.id]);
    const renamed = await owner
      .patch(`/api/plans/${plan.id}/photos/${photo.id}`)
      .send({ caption: 'After the lift' });
    expect(PlanPhotoSchema.parse(renamed.body).caption).toBe('After the lift');
    const long = await owner
      .patch(`/api/plans/${plan.id}/photos/${photo.id}`)
      .send({ caption: 'x'.repeat(201) });
    expect(long.status).toBe(400);
    const filesBefore = readdirSync(join(server.dir, 'photos')).length;
    expect((await owner.delete(`/api/plans/${plan.id}/photos/${photo.id}`)).status).toBe(204);
    expect(readdirSync(join(server.dir, 'photos')).length).toBe(filesBefore - 2);
    expect((await owner.get(photo.url)).status).toBe(404);
  });

  it("answers 404 for a photo on someone else's plan and 401 signed out", async () => {
    const photo = PlanPhotoSchema.parse((await upload(await photoPng(), 'x.png')).body);
    const stranger = (await signedInAgent(server)).agent;
    expect((await stranger.get(photo.url)).status).toBe(404);
    const upload2 = await stranger
      .post(`/api/plans/${plan.id}/photos`)
      .field('partId', 'set-1')
      .attach('file', await photoPng(), 'x.png');
    expect(upload2.status).toBe(404);
  });
});
