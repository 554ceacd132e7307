// Route handlers shared by the registers (items, risks, activities, correlations, drivers):
//   GET    /api/projects/:id/:register            → { rows }
//   POST   /api/projects/:id/:register            → a batch { upserts, deletes, order } → { rows, deleted, cascaded }
//   PUT    /api/projects/:id/:register/:rowId     → one row with its version → { row }
//   DELETE /api/projects/:id/:register/:rowId?version=N
import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { idParam } from '@/lib/http/params';
import { requireActor } from '@/lib/auth/guard';
import { badRequest } from '@/lib/errors';
import { saveBatch } from '@/lib/services/registers/batch';
import { listRegister } from '@/lib/services/registers/read';
import type { RegisterKind } from '@/lib/validation/registers';

type ListCtx = { params: Promise<{ id: string }> };
type RowCtx = { params: Promise<{ id: string; rowId: string }> };

export function registerRoutes(kind: RegisterKind) {
  return {
    GET: handle(async (_request: Request, ctx: ListCtx) => {
      const actor = await requireActor('project:read');
      const rows = await listRegister(actor, idParam((await ctx.params).id, 'Project'), kind);
      return NextResponse.json({ rows });
    }),
    POST: handle(async (request: Request, ctx: ListCtx) => {
      const actor = await requireActor('project:write');
      const id = idParam((await ctx.params).id, 'Project');
      return NextResponse.json(await saveBatch(actor, id, kind, await readJson(request)));
    }),
  };
}

export function registerRowRoutes(kind: RegisterKind) {
  return {
    PUT: handle(async (request: Request, ctx: RowCtx) => {
      const actor = await requireActor('project:write');
      const { id, rowId } = await ctx.params;
      const body = await readJson(request);
      if (!body || typeof body !== 'object') throw badRequest('Send the row as a JSON object.');
      const row = { ...(body as object), id: idParam(rowId, 'Row') };
      const result = await saveBatch(actor, idParam(id, 'Project'), kind, { upserts: [row] });
      return NextResponse.json({ row: result.rows[0], cascaded: result.cascaded });
    }),
    DELETE: handle(async (request: Request, ctx: RowCtx) => {
      const actor = await requireActor('project:write');
      const { id, rowId } = await ctx.params;
      const version = Number(new URL(request.url).searchParams.get('version'));
      if (!Number.isInteger(version) || version < 1) {
        throw badRequest('version: give the version of the row you read (?version=N).', [
          { path: 'version', message: 'Required: the version of the row you read.' },
        ]);
      }
      const result = await saveBatch(actor, idParam(id, 'Project'), kind, {
        deletes: [{ id: idParam(rowId, 'Row'), version }],
      });
      return NextResponse.json({ deleted: result.deleted, cascaded: result.cascaded });
    }),
  };
}
