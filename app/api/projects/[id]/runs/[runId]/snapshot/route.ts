import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { getRunSnapshot } from '@/lib/services/runs';

type Ctx = { params: Promise<{ id: string; runId: string }> };

/** The model file the run read, as a download: `npm run simulate -- <file>` reproduces it. */
export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('run:read');
  const { id, runId } = await ctx.params;
  const { run, snapshot, projectCode } = await getRunSnapshot(
    actor,
    idParam(id, 'Project'),
    idParam(runId, 'Run'),
  );
  const name = `${projectCode.replace(/[^A-Za-z0-9._-]/g, '_')}-run-${run.id}.model.json`;
  return new Response(`${JSON.stringify(snapshot, null, 2)}\n`, {
    headers: {
      'content-type': 'application/json; charset=utf-8',
      'content-disposition': `attachment; filename="${name}"`,
      'x-input-hash': run.inputHash,
    },
  });
});
