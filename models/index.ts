import 'server-only';
// Every model, with the associations wired in one place after all are defined.
import { sequelize } from '@/lib/db/sequelize';
import { Organization } from './organization';
import { User } from './user';
import { Membership } from './membership';
import { Invitation } from './invitation';
import { Project } from './project';
import { AuditEntry } from './audit-entry';
import { Activity } from './activity';
import { CostItem } from './cost-item';
import { RiskEvent } from './risk-event';
import { Correlation } from './correlation';
import { RiskDriver } from './risk-driver';
import { SimulationRun } from './simulation-run';
import { Subscription } from './subscription';
import { Invoice } from './invoice';
import { WebhookEvent } from './webhook-event';
import { OutboundMessage } from './outbound-message';
import { NotificationPreference } from './notification-preference';
import { PasswordResetToken } from './password-reset-token';
import { Approval } from './approval';
import { WorkCalendar } from './work-calendar';

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

Activity.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
CostItem.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
RiskEvent.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
Correlation.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
Activity.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
CostItem.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
RiskEvent.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
Correlation.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
Project.hasMany(Activity, { foreignKey: 'projectId', as: 'activities' });
Project.hasMany(CostItem, { foreignKey: 'projectId', as: 'costItems' });
Project.hasMany(RiskEvent, { foreignKey: 'projectId', as: 'riskEvents' });
Project.hasMany(Correlation, { foreignKey: 'projectId', as: 'correlations' });
CostItem.belongsTo(Activity, { foreignKey: 'activityId', as: 'activity' });
RiskDriver.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
RiskDriver.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
Project.hasMany(RiskDriver, { foreignKey: 'projectId', as: 'riskDrivers' });
RiskEvent.belongsTo(Activity, { foreignKey: 'activityId', as: 'activity' });

OutboundMessage.belongsTo(User, { foreignKey: 'userId', as: 'user' });
NotificationPreference.belongsTo(User, { foreignKey: 'userId', as: 'user' });
PasswordResetToken.belongsTo(User, { foreignKey: 'userId', as: 'user' });

Organization.hasOne(Subscription, { foreignKey: 'organizationId', as: 'subscription' });
Subscription.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
Organization.hasMany(Invoice, { foreignKey: 'organizationId', as: 'billingInvoices' });
Invoice.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });
WebhookEvent.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });

SimulationRun.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
SimulationRun.belongsTo(User, { foreignKey: 'startedById', as: 'startedBy' });
Project.hasMany(SimulationRun, { foreignKey: 'projectId', as: 'runs' });

Approval.belongsTo(Project, { foreignKey: 'projectId', as: 'project' });
Approval.belongsTo(SimulationRun, { foreignKey: 'runId', as: 'run' });
Approval.belongsTo(User, { foreignKey: 'sponsorId', as: 'sponsor' });
Project.hasMany(Approval, { foreignKey: 'projectId', as: 'approvals' });

Organization.hasOne(WorkCalendar, { foreignKey: 'organizationId', as: 'workCalendar' });
WorkCalendar.belongsTo(Organization, { foreignKey: 'organizationId', as: 'organization' });

export {
  Subscription,
  Invoice,
  WebhookEvent,
  OutboundMessage,
  NotificationPreference,
  PasswordResetToken,
  Activity,
  CostItem,
  RiskEvent,
  Correlation,
  RiskDriver,
  sequelize,
  Organization,
  User,
  Membership,
  Invitation,
  Project,
  AuditEntry,
  SimulationRun,
  Approval,
  WorkCalendar,
};
