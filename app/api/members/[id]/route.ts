import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { changeRole, removeMember } from '@/lib/services/members';

type Ctx = { params: Promise<{ id: string }> };

export const PATCH = handle(async (request: Request, ctx: Ctx) => {
  const actor = await requireActor('members:manage');
  const id = idParam((await ctx.params).id, 'Member');
  return NextResponse.json({ role: await changeRole(actor, id, await readJson(request)) });
});

export const DELETE = handle(async (_request: Request, ctx: Ctx) => {
  const actor = await requireActor('members:manage');
  await removeMember(actor, idParam((await ctx.params).id, 'Member'));
  return new NextResponse(null, { status: 204 });
});
