// Every model, with the associations wired in one place after all are defined.
import { sequelize } from '@/lib/db/sequelize';
import { Organization } from './organization';
import { User } from './user';
import { Membership } from './membership';
import { Invitation } from './invitation';
import { Project } from './project';
import { AuditEntry } from './audit-entry';

Organization.hasMany(Membership, { foreignKey: 'organizationId', as: 'memberships' });
Membership.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });

Organization.hasMany(Invitation, { foreignKey: 'organizationId', as: 'invitations' });
Invitation.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
Invitation.belongsTo(User, { foreignKey: 'invitedById', as: 'invitedBy' });

Organization.hasMany(Project, { foreignKey: 'organizationId', as: 'projects' });
Project.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });

AuditEntry.belongsTo(User, { foreignKey: 'userId', as: 'user' });
AuditEntry.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
AuditEntry.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });

export { sequelize, Organization, User, Membership, Invitation, Project, AuditEntry };
