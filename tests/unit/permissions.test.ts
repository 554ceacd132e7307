import { describe, expect, it } from 'vitest';
import { ACTIONS, can, PAID_ROLES, ROLES } from '@/lib/auth/roles';
import { landingPath } from '@/lib/auth/landing';

// The role table of the product design: owner everything; estimator edits and runs;
// sponsor reads, approves and comments; billing manages seats and sees no project data.
describe('permission table', () => {
  it('gives the owner every action', () => {
    expect(ACTIONS.every((a) => can('owner', a))).toBe(true);
  });

  it('lets estimators edit and run but not manage members or billing', () => {
    expect(can('estimator', 'project:write')).toBe(true);
    expect(can('estimator', 'run:start')).toBe(true);
    expect(can('estimator', 'members:manage')).toBe(false);
    expect(can('estimator', 'billing:manage')).toBe(false);
    expect(can('estimator', 'baseline:decide')).toBe(false);
  });

  it('lets sponsors read and decide but never change inputs or start runs', () => {
    expect(can('sponsor', 'project:read')).toBe(true);
    expect(can('sponsor', 'baseline:decide')).toBe(true);
    expect(can('sponsor', 'project:write')).toBe(false);
    expect(can('sponsor', 'run:start')).toBe(false);
  });

  it('keeps billing members away from project data', () => {
    expect(ACTIONS.filter((a) => can('billing', a))).toEqual(['billing:read', 'billing:manage']);
  });

  it("leaves the organisation's own settings (self-approval) to owners", () => {
    expect(ROLES.filter((r) => can(r, 'organization:manage'))).toEqual(['owner']);
  });

  it('starts each role on a page it may see: billing on billing, the others on the projects', () => {
    expect(Object.fromEntries(ROLES.map((r) => [r, landingPath(r)]))).toEqual({
      owner: '/projects',
      estimator: '/projects',
      sponsor: '/projects',
      billing: '/settings/billing',
    });
  });

  it('counts owners and estimators as paid seats only', () => {
    expect(ROLES.filter((r) => PAID_ROLES.has(r))).toEqual(['owner', 'estimator']);
  });
});
