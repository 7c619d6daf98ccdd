// Every entity, listed explicitly: folder discovery does not work inside the Next bundle.
import { UserSchema } from './user.entity';
import { SessionSchema } from './session.entity';
import { OrganisationSchema } from './organisation.entity';
import { MembershipSchema } from './membership.entity';
import { InvitationSchema } from './invitation.entity';
import { UserTokenSchema } from './user-token.entity';
import { OutboxMessageSchema } from './outbox-message.entity';
import { WorkerHeartbeatSchema } from './worker-heartbeat.entity';
import { AuditEventSchema } from './audit-event.entity';
import { AssetSchema } from './asset.entity';
import { ZoneSchema } from './zone.entity';
import { AnodeModelSchema } from './anode-model.entity';
import { DesignSchema } from './design.entity';
import { AnodeGroupSchema, AnodeGroupChangeSchema } from './anode-group.entity';
import { SurveySchema, SurveyReadingSchema, SurveyAttachmentSchema, SurveyAttachmentUploadSchema } from './survey.entity';
import { StripeEventSchema } from './stripe-event.entity';
import { DockingSchema } from './docking.entity';
import { RenewalSchema } from './renewal.entity';
import { IdempotencyKeySchema } from './idempotency-key.entity';

export * from './user.entity';
export * from './session.entity';
export * from './organisation.entity';
export * from './membership.entity';
export * from './invitation.entity';
export * from './user-token.entity';
export * from './outbox-message.entity';
export * from './worker-heartbeat.entity';
export * from './audit-event.entity';
export * from './asset.entity';
export * from './zone.entity';
export * from './anode-model.entity';
export * from './design.entity';
export * from './anode-group.entity';
export * from './survey.entity';
export * from './stripe-event.entity';
export * from './docking.entity';
export * from './renewal.entity';
export * from './idempotency-key.entity';

export const allEntities = [
  UserSchema,
  SessionSchema,
  OrganisationSchema,
  MembershipSchema,
  InvitationSchema,
  UserTokenSchema,
  OutboxMessageSchema,
  AuditEventSchema,
  AssetSchema,
  ZoneSchema,
  AnodeModelSchema,
  DesignSchema,
  AnodeGroupSchema,
  AnodeGroupChangeSchema,
  SurveySchema,
  SurveyReadingSchema,
  SurveyAttachmentSchema,
  SurveyAttachmentUploadSchema,
  StripeEventSchema,
  DockingSchema,
  IdempotencyKeySchema,
  RenewalSchema,
  WorkerHeartbeatSchema,
];
