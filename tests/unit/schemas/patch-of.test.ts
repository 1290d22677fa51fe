import { z } from 'zod';
import { patchOf } from '@/shared/schemas/patch-of';
import { PostUpdateSchema, SiteUpdateSchema } from '@/shared/schemas/site';

describe('patchOf', () => {
  it('leaves out what the client left out, instead of filling in defaults', () => {
    const schema = z.object({ a: z.number().default(0), b: z.string().min(2) });
    expect(patchOf(schema).parse({})).toEqual({});
    expect(patchOf(schema).parse({ a: 3 })).toEqual({ a: 3 });
    // Rules stay.
    expect(patchOf(schema).safeParse({ b: 'x' }).success).toBe(false);
  });

  // Regression: PATCH /sites/:id { name } used to wipe the boundary, zones, notes and time zone,
  // and PATCH …/posts/:id { eyeHeightM } reset structure height, sector and status.
  it('keeps site and post fields a PATCH leaves out', () => {
    expect(SiteUpdateSchema.parse({ name: 'Harrowmere Forest District', version: 3 })).toEqual({
      name: 'Harrowmere Forest District',
      version: 3,
    });
    expect(PostUpdateSchema.parse({ eyeHeightM: 2, version: 1 })).toEqual({ eyeHeightM: 2, version: 1 });
    expect(SiteUpdateSchema.parse({ boundary: null, version: 1 })).toEqual({ boundary: null, version: 1 });
    expect(SiteUpdateSchema.safeParse({ timeZone: 'Mars/Olympus', version: 1 }).success).toBe(false);
  });
});
