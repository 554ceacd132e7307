import { describe, expect, it } from 'vitest';
import { signUpSchema } from '@/lib/validation/auth';
import { projectSchema } from '@/lib/validation/project';
import { parseOrThrow } from '@/lib/validation/parse';
import { AppError } from '@/lib/errors';

describe('input validation', () => {
  it('normalises the e-mail and names every bad field', () => {
    const ok = signUpSchema.parse({
      name: ' Ada ',
      organizationName: 'Byrne',
      email: ' Ada@Example.COM ',
      password: '0123456789',
    });
    expect(ok.email).toBe('ada@example.com');
    expect(ok.name).toBe('Ada');
    try {
      parseOrThrow(signUpSchema, { name: '', organizationName: 'B', email: 'x', password: '1' });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(AppError);
      const err = e as AppError;
      expect(err.status).toBe(400);
      expect(err.issues!.map((i) => i.path).sort()).toEqual([
        'email',
        'name',
        'organizationName',
        'password',
      ]);
    }
  });

  it('accepts a project and refuses a bad currency, class or date', () => {
    const base = {
      name: 'Quay wall',
      code: 'qw-1',
      currency: 'gbp',
      estimateClass: '3',
      stage: 'Concept',
      baseDate: '2027-02-01',
    };
    expect(projectSchema.parse(base)).toMatchObject({ code: 'QW-1', currency: 'GBP', estimateClass: 3 });
    const bad = projectSchema.safeParse({
      ...base,
      currency: 'pounds',
      estimateClass: 7,
      baseDate: '1/2/2027',
    });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues.map((i) => i.path.join('.')).sort()).toEqual([
      'baseDate',
      'currency',
      'estimateClass',
    ]);
  });
});
