import { NextResponse } from 'next/server';
import { handle, readJson } from '@/lib/http/route';
import { signUp } from '@/lib/services/accounts';

export const POST = handle(async (request: Request) => {
  const created = await signUp(await readJson(request));
  return NextResponse.json(created, { status: 201 });
});
