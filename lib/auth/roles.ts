// The one permission table: what each role may do. Pages, route handlers and
// server actions all ask `can(role, action)` through the guard.
export const ROLES = ['owner', 'estimator', 'sponsor', 'billing'] as const;
export type Role = (typeof ROLES)[number];

// For each action, the roles that may take it (the owner takes every action).
const WHO_MAY = {
  'project:read': ['owner', 'estimator', 'sponsor'],
  'project:write': ['owner', 'estimator'],
  'project:export': ['owner', 'estimator', 'sponsor'],
  'run:read': ['owner', 'estimator', 'sponsor'],
  'run:start': ['owner', 'estimator'],
  'run:cancel': ['owner', 'estimator'],
  'brief:read': ['owner', 'estimator', 'sponsor'],
  'baseline:decide': ['owner', 'sponsor'],
  'comment:write': ['owner', 'estimator', 'sponsor'],
  'members:read': ['owner'],
  'members:manage': ['owner'],
  'organization:manage': ['owner'],
  'calendar:manage': ['owner'],
  'billing:read': ['owner', 'billing'],
  'billing:manage': ['owner', 'billing'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof WHO_MAY;
export const ACTIONS = Object.keys(WHO_MAY) as readonly Action[];

const rolesOf: Record<Action, readonly Role[]> = WHO_MAY;
const actionsOf = (role: Role): ReadonlySet<Action> =>
  new Set(ACTIONS.filter((a) => rolesOf[a].includes(role)));

export const PERMISSIONS: Record<Role, ReadonlySet<Action>> = {
  owner: actionsOf('owner'),
  estimator: actionsOf('estimator'),
  sponsor: actionsOf('sponsor'),
  billing: actionsOf('billing'),
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
