/** Shapes the HTTP API answers with: the server's contract, defined once in shared/schema/apiResponses. */
export type {
  AdminUser,
  OutboxMessage,
  Page,
  PublicUser as User,
  Revision,
  ShareRecipient,
  ShareState,
  SketchDetail,
  SketchSummary,
} from '../../shared/schema/apiResponses';
export type { Role } from '../../shared/schema/accounts';
