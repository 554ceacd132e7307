import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { decideOnRun, listDecisions } from '@/lib/services/approvals';

type Ctx = { params: Promise<{ id: string }> };

// Decisions are written once: there is deliberately no PUT, PATCH or DELETE (Next answers 405).

export const GET = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('project:read');
  return NextResponse.json({
    decisions: await listDecisions(actor, idParam((await ctx.params).id, 'Project')),
  });
});

export const POST = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('baseline:decide');
  const id = idParam((await ctx.params).id, 'Project');
  return NextResponse.json(
    { decision: await decideOnRun(actor, id, await readJson(request)) },
    { status: 201 },
  );
});
