// GET /api/projects/:id/audit?before=<entry id>&limit=100 → { entries, next }, newest first.
import { NextResponse } from 'next/server';
import { handle } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { listAudit } from '@/lib/services/registers/read';

type Ctx = { params: Promise<{ id: string }> };

export const GET = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:read');
  const projectId = idParam((await ctx.params).id, 'Project');
  const params = new URL(request.url).searchParams;
  const before = Number(params.get('before')) || undefined;
  const limit = Number(params.get('limit')) || undefined;
  return NextResponse.json(await listAudit(actor, projectId, { before, limit }));
});
