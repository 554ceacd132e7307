import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { requireActor } from '@/lib/auth/guard';
import { createProject, listProjectsWithEstimates } from '@/lib/services/projects';

export const GET = handle(async (request: Request) => {
  const actor = await requireActor('project:read');
  const includeArchived = new URL(request.url).searchParams.get('archived') === '1';
  return NextResponse.json({ projects: await listProjectsWithEstimates(actor, { includeArchived }) });
});

export const POST = handle(async (request: Request) => {
  const actor = await requireActor('project:write');
  return NextResponse.json({ project: await createProject(actor, await readJson(request)) }, { status: 201 });
});
