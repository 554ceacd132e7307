// GET /api/projects/:id/export?format=model|xlsx|csv&register=items|risks|activities|correlations|drivers|all
//   [&riskValues=pre|post for the model file]. Exports are reads: sponsors may download.
import { NextResponse } from 'next/server';
import { z } from 'zod';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { parseOrThrow } from '@/lib/validation/parse';
import { REGISTER_KINDS } from '@/lib/validation/registers';
import { exportModel } from '@/lib/services/model-file';
import { getProject } from '@/lib/services/projects';
import { exportRegisters } from '@/lib/services/registers/export';

type Ctx = { params: Promise<{ id: string }> };

const querySchema = z.object({
  format: z.enum(['model', 'xlsx', 'csv'], { message: 'format is model, xlsx or csv.' }).default('xlsx'),
  register: z
    .enum([...REGISTER_KINDS, 'all'], {
      message: 'register is items, risks, activities, correlations, drivers or all.',
    })
    .default('all'),
  riskValues: z.enum(['pre', 'post'], { message: 'riskValues is pre or post.' }).default('pre'),
});

const attachment = (name: string) => `attachment; filename="${name.replace(/[^A-Za-z0-9._-]/g, '_')}"`;

export const GET = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:export');
  const projectId = idParam((await ctx.params).id, 'Project');
  const q = parseOrThrow(querySchema, Object.fromEntries(new URL(request.url).searchParams));
  if (q.format === 'model') {
    const [project, model] = await Promise.all([
      getProject(actor, projectId),
      exportModel(actor, projectId, { riskValues: q.riskValues }),
    ]);
    return new NextResponse(JSON.stringify(model, null, 2), {
      headers: {
        'content-type': 'application/json; charset=utf-8',
        'content-disposition': attachment(`${project.code}-model.json`),
      },
    });
  }
  const file = await exportRegisters(actor, projectId, q.format, q.register);
  return new NextResponse(typeof file.body === 'string' ? file.body : new Uint8Array(file.body), {
    headers: { 'content-type': file.contentType, 'content-disposition': attachment(file.fileName) },
  });
});
