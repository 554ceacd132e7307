// GET /api/projects/:id/runs/:runId/allocation?format=csv|xlsx: the run's contingency allocation
// as a download. A read: anyone who may read the run may download it.
import { z } from 'zod';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { parseOrThrow } from '@/lib/validation/parse';
import { allocationFile } from '@/lib/services/runs';

type Ctx = { params: Promise<{ id: string; runId: string }> };

const querySchema = z.object({
  format: z.enum(['csv', 'xlsx'], { message: 'format is csv or xlsx.' }).default('xlsx'),
});

export const GET = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('run:read');
  const { id, runId } = await ctx.params;
  const q = parseOrThrow(querySchema, Object.fromEntries(new URL(request.url).searchParams));
  const file = await allocationFile(actor, idParam(id, 'Project'), idParam(runId, 'Run'), q.format);
  return new Response(typeof file.body === 'string' ? file.body : new Uint8Array(file.body), {
    headers: {
      'content-type': file.contentType,
      'content-disposition': `attachment; filename="${file.fileName}"`,
    },
  });
});
