// Static migration list: works the same under tsx, Vitest and a bundled build (STACK.md).
import type { Knex } from 'knex';
import * as addUsers from './202512010900_add_users.ts';
import * as addBuildings from './202512010901_add_buildings.ts';
import * as addMemberships from './202512010902_add_memberships.ts';
import * as addInvitations from './202512010903_add_invitations.ts';
import * as addLevels from './202512010904_add_levels.ts';
import * as addStacks from './202512010905_add_stacks.ts';
import * as addStackOps from './202512010906_add_stack_ops.ts';
import * as addAuditLog from './202512010907_add_audit_log.ts';
import * as addOutbox from './202512010908_add_outbox.ts';
import * as addMailLog from './202512010909_add_mail_log.ts';
import * as addRevisions from './202512011000_add_revisions.ts';
import * as addRevisionTriggers from './202512011001_add_revision_triggers.ts';
import * as addRevisionRecipients from './202512011002_add_revision_recipients.ts';
import * as addCompanySections from './202512011020_add_company_sections.ts';
import * as addStackGoverningLabel from './202612020900_add_stack_governing_label.ts';
import * as addStackNameIndex from './202612031100_add_stack_name_index.ts';
import * as addLevelNameIndex from './202612031101_add_level_name_index.ts';
import * as addMailQueue from './202612031102_add_mail_queue.ts';
import * as addRevisionPackages from './202612031103_add_revision_packages.ts';
import * as addUsersTokenVersion from './202612031200_add_users_token_version.ts';
import * as addUsersEmailVerifiedAt from './202612031201_add_users_email_verified_at.ts';
import * as addInvitationsExpiresAt from './202612031202_add_invitations_expires_at.ts';
import * as addBuildingModels from './202612031300_add_building_models.ts';
import * as addStackGridPosition from './202612031301_add_stack_grid_position.ts';
import * as addStackPositions from './202612031410_add_stack_positions.ts';
import * as addStackPlaceIndex from './202612031420_add_stack_place_index.ts';
import * as addRevisionSteps from './202612031430_add_revision_steps.ts';
import * as addRevisionStepTriggers from './202612031431_add_revision_step_triggers.ts';
import * as addRevisionComments from './202612031432_add_revision_comments.ts';
import * as addStackResults from './202612040750_add_stack_results.ts';
import * as addRevisionOutlines from './202612041000_add_revision_outlines.ts';

const migrations: Record<string, Knex.Migration> = {
  '202512010900_add_users': addUsers,
  '202512010901_add_buildings': addBuildings,
  '202512010902_add_memberships': addMemberships,
  '202512010903_add_invitations': addInvitations,
  '202512010904_add_levels': addLevels,
  '202512010905_add_stacks': addStacks,
  '202512010906_add_stack_ops': addStackOps,
  '202512010907_add_audit_log': addAuditLog,
  '202512010908_add_outbox': addOutbox,
  '202512010909_add_mail_log': addMailLog,
  '202512011000_add_revisions': addRevisions,
  '202512011001_add_revision_triggers': addRevisionTriggers,
  '202512011002_add_revision_recipients': addRevisionRecipients,
  '202512011020_add_company_sections': addCompanySections,
  '202612020900_add_stack_governing_label': addStackGoverningLabel,
  '202612031100_add_stack_name_index': addStackNameIndex,
  '202612031101_add_level_name_index': addLevelNameIndex,
  '202612031102_add_mail_queue': addMailQueue,
  '202612031103_add_revision_packages': addRevisionPackages,
  '202612031200_add_users_token_version': addUsersTokenVersion,
  '202612031201_add_users_email_verified_at': addUsersEmailVerifiedAt,
  '202612031202_add_invitations_expires_at': addInvitationsExpiresAt,
  '202612031300_add_building_models': addBuildingModels,
  '202612031301_add_stack_grid_position': addStackGridPosition,
  '202612031410_add_stack_positions': addStackPositions,
  '202612031420_add_stack_place_index': addStackPlaceIndex,
  '202612031430_add_revision_steps': addRevisionSteps,
  '202612031431_add_revision_step_triggers': addRevisionStepTriggers,
  '202612031432_add_revision_comments': addRevisionComments,
  '202612040750_add_stack_results': addStackResults,
  '202612041000_add_revision_outlines': addRevisionOutlines,
};

export const migrationSource: Knex.MigrationSource<string> = {
  getMigrations: async () => Object.keys(migrations).sort(),
  getMigrationName: (name) => name,
  getMigration: async (name) => {
    const migration = migrations[name];
    if (!migration) throw new Error(`Unknown migration ${name}`);
    return migration;
  },
};
