// The one permission table: what each role may do. Pages, route handlers and
// server actions all ask `can(role, action)` through the guard.
export const ROLES = ['owner', 'estimator', 'sponsor', 'billing'] as const;
export type Role = (typeof ROLES)[number];

export const ACTIONS = [
  'project:read',
  'project:write',
  'project:export',
  'run:read',
  'run:start',
  'run:cancel',
  'brief:read',
  'baseline:decide',
  'comment:write',
  'members:read',
  'members:manage',
  'billing:read',
  'billing:manage',
] as const;
export type Action = (typeof ACTIONS)[number];

const ESTIMATING: Action[] = [
  'project:read',
  'project:write',
  'project:export',
  'run:read',
  'run:start',
  'run:cancel',
  'brief:read',
  'comment:write',
];

export const PERMISSIONS: Record<Role, ReadonlySet<Action>> = {
  owner: new Set(ACTIONS),
  estimator: new Set(ESTIMATING),
  sponsor: new Set<Action>([
    'project:read',
    'project:export',
    'run:read',
    'brief:read',
    'baseline:decide',
    'comment:write',
  ]),
  billing: new Set<Action>(['billing:read', 'billing:manage']),
};

export function can(role: Role, action: Action): boolean {
  return PERMISSIONS[role].has(action);
}

/** Owners and estimators take a paid seat; sponsors and billing members are free. */
export const PAID_ROLES: ReadonlySet<Role> = new Set<Role>(['owner', 'estimator']);

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  estimator: 'Estimator',
  sponsor: 'Sponsor',
  billing: 'Billing',
};
