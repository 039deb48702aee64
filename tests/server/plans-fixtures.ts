/** Small helpers shared by the plans library's API tests. */
import sharp from 'sharp';
import { PlanRecordSchema, type PlanRecord } from '../../shared/schemas/plans.schema';
import type { Plan } from '../../shared/engine/document/plan.schema';
import type { signedInAgent } from './server.harness';

export type Agent = Awaited<ReturnType<typeof signedInAgent>>['agent'];

export async function createPlan(agent: Agent, document: Plan): Promise<PlanRecord> {
  const res = await agent.post('/api/plans').send({ document });
  if (res.status !== 201) throw new Error(`plan not created: ${res.status} ${JSON.stringify(res.body)}`);
  return PlanRecordSchema.parse(res.body);
}

/** A small real PNG carrying a text chunk and EXIF, as a phone or camera would write it. */
export async function photoPng(width = 640, height = 480): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: '#9b4a2c' } })
    .png()
    .withExif({ IFD0: { Artist: 'Bench camera', Copyright: 'Workshop 12' } })
    .toBuffer();
}

/** A JPEG with an EXIF block naming the camera owner. */
export async function photoJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 800, height: 600, channels: 3, background: '#2c5f9b' } })
    .jpeg()
    .withExif({ IFD0: { Artist: 'Bench camera', Copyright: 'Workshop 12' } })
    .toBuffer();
}
